import { describe, expect, it } from 'vitest';
import { buildChoiceData } from '../../../server/engine/estimation/build-choice-data';
import { fitMnl } from '../../../server/engine/estimation/fit-mnl';

describe('buildChoiceData', () => {
  const built = buildChoiceData(
    ['bill', 'river'],
    [
      { respondent: 'a', task: 1, alt: 'x', chosen: 0, values: [3, 1] },
      { respondent: 'a', task: 1, alt: 'y', chosen: 1, values: [6, 2] },
      { respondent: 'b', task: 7, alt: 'x', chosen: 1, values: [0, 0] },
      { respondent: 'b', task: 7, alt: 'y', chosen: 0, values: [10, 2] },
      { respondent: 'b', task: 7, alt: 'z', chosen: 0, values: [15, 1] },
      { respondent: 'a', task: 2, alt: 'x', chosen: 1, values: [3, 0], holdout: true },
      { respondent: 'a', task: 2, alt: 'y', chosen: 0, values: [0, 1], holdout: true },
    ],
  );

  it('groups rows by respondent and task and stores x_j − x_chosen for non-chosen alternatives', async () => {
    const { data } = built;
    expect(data.respondentIds).toEqual(['a', 'b']);
    expect([...data.taskStart]).toEqual([0, 1, 2]);
    expect([...data.altCount]).toEqual([2, 3]);
    expect([...data.diffStart]).toEqual([0, 1, 3]);
    expect([...data.diffs]).toEqual([-3, -1, 10, 2, 15, 1]);
  });

  it('keeps holdout tasks apart', async () => {
    expect(built.holdout).not.toBeNull();
    expect(built.holdout!.respondentIds).toEqual(['a']);
    expect([...built.holdout!.diffs]).toEqual([-3, 1]);
  });

  it('handles tasks with different numbers of alternatives in the MNL: LL(0) = Σ ln(1/J_t) (docs/methods.md "Estimation check values")', async () => {
    const fit = await fitMnl(
      buildChoiceData(
        ['x'],
        [
          { respondent: 1, task: 1, alt: 1, chosen: 1, values: [1] },
          { respondent: 1, task: 1, alt: 2, chosen: 0, values: [0] },
          { respondent: 1, task: 2, alt: 1, chosen: 0, values: [1] },
          { respondent: 1, task: 2, alt: 2, chosen: 1, values: [0] },
          { respondent: 1, task: 2, alt: 3, chosen: 0, values: [2] },
          { respondent: 2, task: 1, alt: 1, chosen: 0, values: [2] },
          { respondent: 2, task: 1, alt: 2, chosen: 1, values: [1] },
        ],
      ).data,
    );
    expect(fit.loglikNull).toBeCloseTo(2 * Math.log(1 / 2) + Math.log(1 / 3), 14);
  });
});
