/** Invalid options of the HB and latent class estimators and specs, refused before any numerics. */
import { describe, expect, it } from 'vitest';
import { buildChoiceData } from '../../../server/engine/estimation/build-choice-data';
import type { LongChoiceRow } from '../../../server/engine/estimation/choice-data';
import { EstimationOptionsError } from '../../../server/engine/estimation/estimation-errors';
import { checkHbOptions } from '../../../server/engine/hb/check-hb-options';
import { checkLatentClassOptions } from '../../../server/engine/latent-class/check-latent-class-options';
import { estimationSpecSchema } from '../../../shared/schemas/estimation-spec';

function panel(respondents: number, tasks: number): LongChoiceRow[] {
  const rows: LongChoiceRow[] = [];
  for (let n = 1; n <= respondents; n++)
    for (let t = 1; t <= tasks; t++) {
      rows.push({ respondent: n, task: t, alt: 1, chosen: (n + t) % 2, values: [1, t % 3] });
      rows.push({
        respondent: n,
        task: t,
        alt: 2,
        chosen: 1 - ((n + t) % 2),
        values: [0, (t + n) % 4],
      });
    }
  return rows;
}
const data = buildChoiceData(['x', 'z'], panel(30, 4)).data;
const hb = {
  coefficients: [
    { name: 'x', distribution: 'normal' },
    { name: 'z', distribution: 'normal' },
  ],
};

describe('checkHbOptions', () => {
  const cases: [string, object, string, RegExp][] = [
    [
      'a triangular coefficient',
      { coefficients: [{ name: 'x', distribution: 'triangular' }] },
      'coefficients.0.distribution',
      /normal, lognormal/,
    ],
    [
      'only fixed coefficients',
      { coefficients: [{ name: 'x', distribution: 'fixed' }] },
      'coefficients',
      /at least one random/,
    ],
    [
      'burn-in as long as the run',
      { ...hb, iterations: 1000, burnin: 1000 },
      'mcmc.burnin',
      /between 0 and 999/,
    ],
    [
      'too few kept draws',
      { ...hb, iterations: 1000, burnin: 900, thin: 10 },
      'mcmc.thin',
      /keeps 10 draws/,
    ],
    ['no chains', { ...hb, chains: 0 }, 'mcmc.chains', /between 1 and 16/],
    ['no MH steps', { ...hb, steps: 0 }, 'mcmc.steps', /between 1 and 50/],
    ['a fractional number of MH steps', { ...hb, steps: 2.5 }, 'mcmc.steps', /between 1 and 50/],
    ['ν at or below K − 1', { ...hb, priors: { nu: 1 } }, 'priors.nu', /exceed 1/],
    [
      'a negative prior variance',
      { ...hb, priors: { muVariance: -1 } },
      'priors.muVariance',
      /positive/,
    ],
    [
      'correlation with one random coefficient',
      { coefficients: [{ name: 'x', distribution: 'normal' }], correlated: true },
      'correlated',
      /two random/,
    ],
    ['an unknown cost', { ...hb, cost: 'price' }, 'cost', /not in the model/],
  ];
  for (const [what, options, field, message] of cases) {
    it(`refuses ${what}`, () => {
      try {
        checkHbOptions(data, options as never);
        expect.unreachable();
      } catch (err) {
        expect(err).toBeInstanceOf(EstimationOptionsError);
        expect((err as EstimationOptionsError).field).toBe(field);
        expect((err as Error).message).toMatch(message);
      }
    });
  }
  it('refuses respondents with fewer than 3 tasks, saying how many', () => {
    const short = buildChoiceData(['x', 'z'], panel(5, 2)).data;
    expect(() => checkHbOptions(short, hb)).toThrow(
      /at least 3 choice tasks per respondent for individual estimates; 5 of 5 respondents have fewer \(fewest: 2\)/,
    );
  });
  it("fills the documented defaults, with the Rossi et al. priors and Train's as a named preset", () => {
    const opts = checkHbOptions(data, hb);
    expect(opts).toMatchObject({
      // docs/methods.md, "Hierarchical Bayes logit", Defaults.
      iterations: 40000,
      burnin: 20000,
      thin: 20,
      steps: 5,
      chains: 2,
      seed: 1,
      retained: 1000,
    });
    expect(opts.priors).toEqual({ preset: 'rossi', muMean: 0, muVariance: 100, nu: 5, scale: 5 });
    expect(checkHbOptions(data, { ...hb, priors: { preset: 'train' } }).priors).toMatchObject({
      nu: 2,
      scale: 2,
    });
  });
});

describe('checkLatentClassOptions', () => {
  const lc = { coefficients: [{ name: 'x' }, { name: 'z' }] };
  it('refuses more classes than the respondents can identify', () => {
    expect(() => checkLatentClassOptions(data, { ...lc, classes: 4 })).toThrow(
      /4 classes need 11 parameters and at least 40 respondents; the data have 30/,
    );
  });
  it('refuses one task per respondent', () => {
    const single = buildChoiceData(['x', 'z'], panel(40, 1)).data;
    expect(() => checkLatentClassOptions(single, lc)).toThrow(
      /at least 2 choice tasks per respondent/,
    );
  });
  it('refuses a range that runs backwards, 9 classes, and covariates of the wrong length', () => {
    expect(() => checkLatentClassOptions(data, { ...lc, classes: [3, 2] })).toThrow(
      /from low to high/,
    );
    expect(() => checkLatentClassOptions(data, { ...lc, classes: 9 })).toThrow(/between 1 and 8/);
    expect(() =>
      checkLatentClassOptions(data, {
        ...lc,
        membership: { names: ['size'], values: new Float64Array(3) },
      }),
    ).toThrow(/1 finite values for each of the 30 respondents/);
  });
});

describe('estimation spec of the new families', () => {
  it('accepts hb with mcmc and priors, and latent_class with a class range and membership', () => {
    expect(
      estimationSpecSchema.safeParse({
        model: 'hb',
        coefficients: [
          { name: 'x', distribution: 'normal' },
          { name: 'bill', distribution: 'neg_lognormal' },
        ],
        correlated: true,
        mcmc: { iterations: 4000, burnin: 1000, thin: 5, chains: 3, seed: 4 },
        priors: { preset: 'train' },
      }).success,
    ).toBe(true);
    expect(
      estimationSpecSchema.safeParse({
        model: 'latent_class',
        coefficients: [{ name: 'x' }],
        classes: [2, 5],
        starts: 20,
        membership: ['household_size'],
      }).success,
    ).toBe(true);
  });
  const bad: [string, object, string][] = [
    [
      'hb with a uniform coefficient',
      { model: 'hb', coefficients: [{ name: 'x', distribution: 'uniform' }] },
      'coefficients.0.distribution',
    ],
    [
      'hb keeping fewer than 20 draws',
      {
        model: 'hb',
        coefficients: [{ name: 'x', distribution: 'normal' }],
        mcmc: { iterations: 200, burnin: 100, thin: 10 },
      },
      'mcmc.thin',
    ],
    [
      'hb with 51 MH steps per respondent',
      { model: 'hb', coefficients: [{ name: 'x', distribution: 'normal' }], mcmc: { steps: 51 } },
      'mcmc.steps',
    ],
    [
      'latent_class with a random coefficient',
      { model: 'latent_class', coefficients: [{ name: 'x', distribution: 'normal' }] },
      'coefficients.0.distribution',
    ],
    [
      'latent_class with 9 classes',
      { model: 'latent_class', coefficients: [{ name: 'x' }], classes: 9 },
      'classes',
    ],
    [
      'latent_class with a backwards range',
      { model: 'latent_class', coefficients: [{ name: 'x' }], classes: [4, 2] },
      'classes',
    ],
    [
      'a membership variable listed twice',
      { model: 'latent_class', coefficients: [{ name: 'x' }], membership: ['a', 'a'] },
      'membership.1',
    ],
  ];
  for (const [what, spec, path] of bad) {
    it(`refuses ${what} at ${path}`, () => {
      const parsed = estimationSpecSchema.safeParse(spec);
      expect(parsed.success).toBe(false);
      expect(parsed.error!.issues.map((i) => i.path.join('.'))).toContain(path);
    });
  }
});
