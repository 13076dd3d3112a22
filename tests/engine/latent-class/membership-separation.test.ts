/**
 * Quasi-separation of the latent class membership model (membership-separation.ts;
 * docs/methods.md, "Latent class: quasi-separated membership"):
 * - a constructed case where one background answer puts every respondent who gives it in class 2
 *   (quasi-complete separation, Albert & Anderson 1984, Biometrika 71:1-10: no finite maximum)
 *   ends with a `membership_separated` warning naming that answer; its coefficient has no SE,
 *   while the class coefficients and the other membership coefficients keep theirs;
 * - the same data without that answer fit with no warning and every SE;
 * - the run-off rule on hand-set coefficients: |γ|·(range of the answer) beyond 15;
 * - the SEs of the rest: the inverse of the information with a row and column left out equals
 *   the inverse of the remaining block (closed form of a 2 × 2 inverse).
 */
import { describe, expect, it } from 'vitest';
import { createPrng } from '../../../server/engine/draws/prng';
import { buildChoiceData } from '../../../server/engine/estimation/build-choice-data';
import { fitLatentClass } from '../../../server/engine/latent-class/fit-latent-class';
import { createLatentClassState } from '../../../server/engine/latent-class/latent-class-state';
import { createMembershipDesign } from '../../../server/engine/latent-class/membership-model';
import {
  findRunOffMembership,
  invertInformationWithout,
} from '../../../server/engine/latent-class/membership-separation';
import { simulateTwoClasses, TWO_CLASS_TRUTH } from './latent-class-fixture';

const N = 200;
const sim = simulateTwoClasses(N, 8, 11);
const { data } = buildChoiceData(TWO_CLASS_TRUTH.names, sim.rows);
const coefficients = TWO_CLASS_TRUTH.names.map((name) => ({ name }));
// "Has a water filter": only ever answered yes by respondents of class 2 (half of them).
const prng = createPrng(4, 9);
const filter = Float64Array.from(sim.classOf, (c) => (c === 1 && prng.nextDouble() < 0.5 ? 1 : 0));
const ownsHome = sim.covariate;
const interleave = (a: Float64Array, b: Float64Array) =>
  Float64Array.from({ length: 2 * N }, (_, i) => (i % 2 === 0 ? a : b)[i >> 1]);

describe('latent class membership separation', () => {
  it('ends with a warning naming the answer that separates, and keeps the other SEs', async () => {
    const fit = await fitLatentClass(data, {
      coefficients,
      classes: 2,
      starts: 3,
      membership: { names: ['has_filter', 'owns_home'], values: interleave(filter, ownsHome) },
    });
    expect(fit.warnings).toHaveLength(1);
    const [warning] = fit.warnings;
    expect(warning.code).toBe('membership_separated');
    expect(warning.message).toContain('has_filter');
    expect(warning.message).not.toContain('owns_home (');
    expect(warning.parameters).toEqual(['class2.membership.has_filter']);
    const [constant, hasFilter, home] = fit.classes[1].membership;
    expect(hasFilter.se).toBeNull();
    expect(hasFilter.estimate).toBeGreaterThan(15);
    for (const p of [constant, home, ...fit.classes.flatMap((c) => c.estimates)])
      expect(p.se).toBeGreaterThan(0);
  }, 120_000);

  it('gives no warning and every SE when no answer separates', async () => {
    const fit = await fitLatentClass(data, {
      coefficients,
      classes: 2,
      starts: 3,
      membership: { names: ['owns_home'], values: ownsHome },
    });
    expect(fit.warnings).toEqual([]);
    for (const c of fit.classes) {
      expect(c.shareSe).toBeGreaterThan(0);
      for (const p of [...c.estimates, ...c.membership]) expect(p.se).toBeGreaterThan(0);
    }
  }, 120_000);

  it('calls a coefficient run off when it moves the odds by more than e^15 over the answer’s range', () => {
    const z = createMembershipDesign(4, {
      names: ['yes', 'count'],
      values: Float64Array.from([0, 0, 1, 2, 0, 1, 1, 2]),
    });
    const state = createLatentClassState(4, 3, 1, 3);
    // Class 2: yes 15.5 (range 1) runs off; count 7 (range 2: 14) does not.
    // Class 3: yes −14 does not; count −8 (16) runs off. Constants never count.
    state.gamma.set([40, 15.5, 7, -40, -14, -8]);
    expect(findRunOffMembership(state, z, 4, ['yes', 'count'])).toEqual([
      { class: 2, name: 'yes', estimate: 15.5, parameter: 4 },
      { class: 3, name: 'count', estimate: -8, parameter: 8 },
    ]);
  });

  it('inverts the information without the left-out parameters (closed-form 2 × 2 inverse)', () => {
    // −H = [[4, 1, 9], [1, 3, 9], [9, 9, 1e-20]]; without parameter 2 the inverse of [[4, 1], [1, 3]]
    // is [[3, −1], [−1, 4]] / 11.
    const hess = Float64Array.from([4, 1, 9, 1, 3, 9, 9, 9, 1e-20], (x) => -x);
    const cov = invertInformationWithout(hess, 3, [2])!;
    expect(cov[0]).toBeCloseTo(3 / 11, 14);
    expect(cov[1]).toBeCloseTo(-1 / 11, 14);
    expect(cov[4]).toBeCloseTo(4 / 11, 14);
    expect(cov[2]).toBeNaN();
    expect(cov[8]).toBeNaN();
  });
});
