import { describe, expect, it } from 'vitest';
import { buildChoiceData } from '../../../server/engine/estimation/build-choice-data';
import type { LongChoiceRow } from '../../../server/engine/estimation/choice-data';
import { fitMnl } from '../../../server/engine/estimation/fit-mnl';

/** Ben-Akiva & Lerman (1985, p. 88) 21 travellers: auto time, transit time, choice (docs/methods.md "Estimation check values" [R]). */
const AKIVA: [number, number, 'A' | 'T'][] = [
  [52.9, 4.4, 'T'],
  [4.1, 28.5, 'T'],
  [4.1, 86.9, 'A'],
  [56.2, 31.6, 'T'],
  [51.8, 20.2, 'T'],
  [0.2, 91.2, 'A'],
  [27.6, 79.7, 'A'],
  [89.9, 2.2, 'T'],
  [41.5, 24.5, 'T'],
  [95.0, 43.5, 'T'],
  [99.1, 8.4, 'T'],
  [18.5, 84.0, 'A'],
  [82.0, 38.0, 'A'],
  [8.6, 1.6, 'T'],
  [22.5, 74.1, 'A'],
  [51.4, 83.8, 'A'],
  [81.0, 19.2, 'T'],
  [51.0, 85.0, 'A'],
  [62.2, 90.1, 'A'],
  [95.1, 22.2, 'T'],
  [41.6, 91.5, 'A'],
];

function akivaRows(): LongChoiceRow[] {
  return AKIVA.flatMap(([auto, transit, choice], n) => [
    { respondent: n, task: 1, alt: 'auto', chosen: choice === 'A' ? 1 : 0, values: [1, auto] },
    {
      respondent: n,
      task: 1,
      alt: 'transit',
      chosen: choice === 'T' ? 1 : 0,
      values: [0, transit],
    },
  ]);
}

describe('fitMnl', () => {
  it('binary logit with one dummy equals the closed form ln(k/(n−k)), SE sqrt(n/(k(n−k)))', async () => {
    // Closed form: docs/methods.md "Estimation check values" [C/standard]; n = 20 paired tasks, first alternative chosen k = 14 times.
    const n = 20;
    const k = 14;
    const rows: LongChoiceRow[] = [];
    for (let t = 0; t < n; t++) {
      rows.push({ respondent: t % 5, task: t, alt: 1, chosen: t < k ? 1 : 0, values: [1] });
      rows.push({ respondent: t % 5, task: t, alt: 2, chosen: t < k ? 0 : 1, values: [0] });
    }
    const fit = await fitMnl(buildChoiceData(['x'], rows).data);
    expect(fit.converged).toBe(true);
    expect(fit.estimates[0]).toBeCloseTo(Math.log(k / (n - k)), 10);
    expect(fit.se[0]).toBeCloseTo(Math.sqrt(n / (k * (n - k))), 10);
    // LL(0) = n ln(1/2) (docs/methods.md "Estimation check values").
    expect(fit.loglikNull).toBeCloseTo(n * Math.log(0.5), 12);
  });

  it('reproduces Ben-Akiva & Lerman 21-traveller binary logit (docs/methods.md "Estimation check values")', async () => {
    const fit = await fitMnl(buildChoiceData(['asc_auto', 'time'], akivaRows()).data);
    // [C] values from docs/methods.md "Estimation check values"; Newton converges to machine precision, the 7 printed
    // digits bound the comparison.
    expect(fit.estimates[0]).toBeCloseTo(-0.2375755, 6);
    expect(fit.estimates[1]).toBeCloseTo(-0.0531098, 7);
    expect(fit.se[0]).toBeCloseTo(0.7504767, 6);
    expect(fit.se[1]).toBeCloseTo(0.0206423, 7);
    // LL matches CUTEst AKIVA "SOLUTION 6.1660422124" [R] and §3.1 [C] −6.166042212418.
    expect(fit.loglik).toBeCloseTo(-6.166042212418, 10);
    expect(fit.loglikNull).toBeCloseTo(-14.556090791759, 10);
    expect(fit.rho2).toBeCloseTo(0.576394, 6);
    expect(fit.adjRho2).toBeCloseTo(0.438995, 6);
    // AIC/BIC follow from the definitions (Akaike 1974; Schwarz 1978) with K = 2, n = 21.
    expect(fit.aic).toBeCloseTo(4 + 2 * 6.166042212418, 9);
    expect(fit.bic).toBeCloseTo(2 * Math.log(21) + 2 * 6.166042212418, 9);
    expect(fit.respondents).toBe(21);
    expect(fit.observations).toBe(21);
  });

  it('ASC-only model reproduces the observed shares ln(s_j/s_ref) (docs/methods.md "Estimation check values")', async () => {
    // 3 alternatives, chosen 5, 3, 2 times; constants for alternatives 2 and 3.
    const counts = [5, 3, 2];
    const rows: LongChoiceRow[] = [];
    let task = 0;
    counts.forEach((c, chosenAlt) => {
      for (let i = 0; i < c; i++, task++) {
        for (let j = 0; j < 3; j++) {
          rows.push({
            respondent: task,
            task,
            alt: j,
            chosen: j === chosenAlt ? 1 : 0,
            values: [j === 1 ? 1 : 0, j === 2 ? 1 : 0],
          });
        }
      }
    });
    const fit = await fitMnl(buildChoiceData(['asc2', 'asc3'], rows).data);
    expect(fit.estimates[0]).toBeCloseTo(Math.log(3 / 5), 10);
    expect(fit.estimates[1]).toBeCloseTo(Math.log(2 / 5), 10);
  });

  it('reports in-sample and holdout hit rates', async () => {
    const rows = akivaRows().map((r) => ({ ...r, holdout: Number(r.respondent) >= 16 }));
    const built = buildChoiceData(['asc_auto', 'time'], rows);
    const fit = await fitMnl(built.data, { holdout: built.holdout });
    expect(fit.observations).toBe(16);
    expect(fit.hitRate).toBeGreaterThan(0.5);
    expect(fit.holdoutHitRate).not.toBeNull();
    expect(fit.holdoutHitRate! * 5).toBeCloseTo(Math.round(fit.holdoutHitRate! * 5), 10);
  });
});
