/**
 * Separation is reported only when it is real (Albert & Anderson 1984, Biometrika 71:1-10: the
 * logit MLE does not exist exactly when a direction b makes every chosen alternative weakly
 * best, b·(x_j − x_chosen) ≤ 0 for all rows, strictly somewhere). Complete and quasi-complete
 * separation must fail naming the column and the tasks; data that come close (one contrary
 * choice) must be estimated, at most with a warning about extreme tasks.
 */
import { describe, expect, it } from 'vitest';
import { buildChoiceData } from '../../../server/engine/estimation/build-choice-data';
import type { LongChoiceRow } from '../../../server/engine/estimation/choice-data';
import { findSeparation } from '../../../server/engine/estimation/find-separation';
import { fitMnl } from '../../../server/engine/estimation/fit-mnl';

function pair(
  respondent: number,
  task: number,
  a: number[],
  b: number[],
  chosenA: boolean,
): LongChoiceRow[] {
  return [
    { respondent, task, alt: 1, chosen: chosenA ? 1 : 0, values: a },
    { respondent, task, alt: 2, chosen: chosenA ? 0 : 1, values: b },
  ];
}

/** 40 tasks; x is higher for the chosen alternative in every task (complete separation in x). */
function separated(): LongChoiceRow[] {
  const rows: LongChoiceRow[] = [];
  for (let t = 0; t < 40; t++) {
    const z = ((t * 7) % 5) - 2;
    const chosenA = t % 3 !== 0;
    const xa = chosenA ? 1 + (t % 4) : 0;
    const xb = chosenA ? 0 : 1 + (t % 4);
    rows.push(...pair(1 + Math.floor(t / 8), t, [xa, z], [xb, -z], chosenA));
  }
  return rows;
}

describe('separation', () => {
  it('complete separation fails, naming the column and the perfectly predicted tasks', async () => {
    const data = buildChoiceData(['x', 'z'], separated()).data;
    await expect(fitMnl(data)).rejects.toThrow(
      /perfect prediction \(separation\) — x predicts the choice in 40 tasks/,
    );
    const found = await findSeparation(data);
    expect(found?.tasks).toHaveLength(40);
    expect(Math.abs(found!.direction[0])).toBeGreaterThan(0);
  });

  it('quasi-complete separation (ties in x) also fails', async () => {
    const rows = separated();
    // Two tasks where both alternatives have the same x: x predicts nothing there.
    rows.push(...pair(9, 1, [2, 1], [2, 0], true), ...pair(9, 2, [1, 0], [1, 1], false));
    await expect(fitMnl(buildChoiceData(['x', 'z'], rows).data)).rejects.toThrow(/separation/);
  });

  it('near-separation (one choice contradicts x) is estimated, not reported as separation', async () => {
    const rows = separated();
    rows.push(...pair(9, 1, [3, 0], [0, 0], false));
    const data = buildChoiceData(['x', 'z'], rows).data;
    expect(await findSeparation(data)).toBeNull();
    const fit = await fitMnl(data);
    expect(fit.converged).toBe(true);
    expect(fit.estimates[0]).toBeGreaterThan(1);
    expect(Number.isFinite(fit.se[0])).toBe(true);
  });

  it('an extreme task alone is a warning', async () => {
    // x varies little except in one task where the difference is huge; β·d > 30 there only.
    const rows: LongChoiceRow[] = [];
    for (let t = 0; t < 60; t++) {
      const x = (t % 3) - 1;
      const chosenA = x === 1 ? t % 4 !== 0 : x === 0 ? t % 2 === 0 : t % 4 === 0;
      rows.push(...pair(1 + (t % 10), t, [x], [0], chosenA));
    }
    rows.push(...pair(11, 1, [400], [0], true));
    const fit = await fitMnl(buildChoiceData(['x'], rows).data);
    expect(fit.converged).toBe(true);
    expect(fit.estimates[0]).toBeGreaterThan(0.2); // so β·400 > 30 in that one task
    const warning = fit.warnings.find((w) => w.code === 'extreme_tasks');
    expect(warning?.tasks).toEqual(['respondent 11, task 1']);
  });
});
