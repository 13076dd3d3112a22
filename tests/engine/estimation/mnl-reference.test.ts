import { readFileSync } from 'node:fs';
import path from 'node:path';
import { parse } from 'csv-parse/sync';
import { beforeAll, describe, expect, it } from 'vitest';
import { buildChoiceData } from '../../../server/engine/estimation/build-choice-data';
import { fitMnl } from '../../../server/engine/estimation/fit-mnl';

const fixtures = path.resolve(import.meta.dirname, '../../fixtures/estimation');

/**
 * Reference: survival::clogit 3.5.3 (and nnet::multinom 7.3.18 for the LL) under R 4.2.2,
 * run by scripts/reference/mnl-housing-clogit.R on MASS 7.3.58.2 `housing` expanded to long
 * format; the versions are also stored in the JSON fixture. coxph stops at a relative LL
 * change of 1e-9, so its estimates carry about 1e-7 of optimisation error.
 */
interface Reference {
  names: string[];
  estimates: number[];
  se: number[];
  robustSe: number[];
  loglik: number;
  loglikNull: number;
  multinomLoglik: number;
  respondents: number;
}

describe('fitMnl against survival::clogit on MASS::housing', () => {
  const reference = JSON.parse(
    readFileSync(path.join(fixtures, 'housing-clogit-reference.json'), 'utf8'),
  ) as Reference;
  const records = parse(readFileSync(path.join(fixtures, 'housing-long.csv')), {
    columns: true,
  }) as Record<string, string>[];
  const rows = records.map((r) => ({
    respondent: r.respondent,
    task: r.task,
    alt: r.alt,
    chosen: Number(r.chosen),
    values: reference.names.map((name) => Number(r[name])),
  }));
  let fit: Awaited<ReturnType<typeof fitMnl>>;
  beforeAll(async () => {
    fit = await fitMnl(buildChoiceData(reference.names, rows).data);
  });

  it('matches the log-likelihoods (clogit and multinom) and LL(0)', async () => {
    expect(fit.converged).toBe(true);
    expect(fit.loglik).toBeCloseTo(reference.loglik, 7);
    expect(fit.loglik).toBeCloseTo(reference.multinomLoglik, 8);
    expect(fit.loglikNull).toBeCloseTo(reference.loglikNull, 8);
    expect(fit.respondents).toBe(reference.respondents);
  });

  it('matches the estimates, classical SEs and respondent-clustered robust SEs', async () => {
    reference.names.forEach((name, k) => {
      expect(fit.names[k]).toBe(name);
      expect(Math.abs(fit.estimates[k] - reference.estimates[k])).toBeLessThan(1e-6);
      expect(Math.abs(fit.se[k] / reference.se[k] - 1)).toBeLessThan(1e-6);
      // clogit's cluster variance has no finite-sample factor; ours is multiplied by G/(G−1)
      // (Cameron & Miller 2015 §II.C), so the SEs differ by √(G/(G−1)) exactly.
      const G = reference.respondents;
      const corrected = reference.robustSe[k] * Math.sqrt(G / (G - 1));
      expect(Math.abs(fit.robustSe[k] / corrected - 1)).toBeLessThan(1e-5);
    });
  });
});
