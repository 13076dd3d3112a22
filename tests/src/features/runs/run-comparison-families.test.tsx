// @vitest-environment jsdom
/** The comparison view sets the four families side by side (fit, individual hit rates, means). */
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import type { Run } from '@shared/schemas/run';
import { RunComparison } from '@/features/runs/components/run-comparison';

afterEach(cleanup);

const run = (id: string, model: string, results: Record<string, unknown>): Run =>
  ({
    id,
    name: id,
    model,
    dataHash: 'h',
    spec: { coefficients: [{ name: 'bill', distribution: 'fixed' }], correlated: false },
    results: {
      model,
      respondents: 80,
      observations: 640,
      parameters: 1,
      loglik: -600,
      loglikNull: -700,
      converged: true,
      rho2: 0.14,
      adjRho2: 0.13,
      aic: 1202,
      bic: 1206,
      hitRate: 0.5,
      holdoutHitRate: null,
      estimates: [{ name: 'bill', estimate: -0.2, se: 0.01 }],
      population: [{ name: 'bill', distribution: 'fixed', mean: -0.2, sd: 0 }],
      ...results,
    },
  }) as unknown as Run;

describe('RunComparison', () => {
  it('shows each family, HB’s log marginal density, individual hit rates and population means', () => {
    render(
      <RunComparison
        runs={[
          run('MNL', 'mnl', {}),
          run('HB', 'hb', {
            logMarginalDensity: -580.25,
            individualHitRate: 0.71,
            population: [{ name: 'bill', distribution: 'neg_lognormal', mean: -0.31, sd: 0.2 }],
          }),
          run('LC', 'latent_class', { caic: 1250.5, individualHitRate: 0.64 }),
        ]}
      />,
    );
    const row = (label: string) =>
      within(screen.getByRole('rowheader', { name: label }).closest('tr')!)
        .getAllByRole('cell')
        .map((c) => c.textContent);
    expect(row('Model')).toEqual([
      'Multinomial logit (MNL)',
      'Hierarchical Bayes logit',
      'Latent class logit',
    ]);
    expect(row('Log marginal density (HB)')).toEqual(['—', '−580.25', '—']);
    expect(row('CAIC')[2]).toBe('1,250.5');
    expect(row('Hit rate, individual estimates')).toEqual(['—', '71.0%', '64.0%']);
    expect(row('bill: population mean of β')).toEqual(['−0.200', '−0.310', '−0.200']);
    // No χ² LR test with HB or latent class runs.
    expect(
      screen.getAllByText(/no maximised log-likelihood|not tested by a χ²/).length,
    ).toBeGreaterThan(0);
  });
});
