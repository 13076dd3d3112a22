// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import type { Run, RunResult } from '@shared/schemas/run';
import { ParameterTable } from '@/features/runs/components/parameter-table';
import { ImpliedCovariance } from '@/features/runs/components/implied-covariance';
import { WtpTable } from '@/features/runs/components/wtp-table';
import { FitStatistics } from '@/features/runs/components/fit-statistics';
import {
  describeResume,
  describeRunStage,
  getConvergenceShare,
  RunProgress,
} from '@/features/runs/components/run-progress';

afterEach(cleanup);

const interval = (estimate: number, se: number) => ({
  estimate,
  se,
  deltaLower: estimate - 1.96 * se,
  deltaUpper: estimate + 1.96 * se,
  simulatedSe: se,
  lower: estimate - 1.96 * se,
  upper: estimate + 1.96 * se,
});

const results = {
  columns: [
    { key: 'attr:bill', coefficient: 'bill', label: 'Monthly bill increase (€)', wtpUnit: null },
    {
      key: 'attr:interrupt',
      coefficient: 'interrupt',
      label: 'Supply interruptions per year',
      wtpUnit: '€ of monthly bill increase per +1 in Supply interruptions per year',
    },
    { key: 'attr:river:good', coefficient: 'river_good', label: 'River health: good' },
  ],
  costUnit: '€',
  population: [
    { name: 'bill', distribution: 'fixed' },
    { name: 'interrupt', distribution: 'normal' },
    { name: 'river_good', distribution: 'normal' },
  ],
  estimates: [
    { name: 'bill', estimate: -0.2, se: 0.01, robustSe: 0.01 },
    { name: 'interrupt.mean', estimate: -0.5, se: 0.05, robustSe: 0.05 },
    { name: 'interrupt.sd', estimate: -0.032, se: 0.021, robustSe: 0.021 },
  ],
  wtp: [{ name: 'interrupt', ...interval(-2.5, 0.3), median: interval(-2.5, 0.3) }],
  covariance: { used: 'robust' },
  derived: [
    { name: 'interrupt~interrupt', quantity: 'covariance', label: '', ...interval(0.64, 0.16) },
    { name: 'river_good~interrupt', quantity: 'covariance', label: '', ...interval(0.24, 0.085) },
    { name: 'river_good~river_good', quantity: 'covariance', label: '', ...interval(0.25, 0.1) },
    { name: 'river_good~interrupt', quantity: 'correlation', label: '', ...interval(0.6, 0.12) },
  ],
} as unknown as RunResult;

describe('ParameterTable', () => {
  it('shows a spread as |s| with its interval carried over, and says so once', () => {
    render(<ParameterTable results={results} />);
    const row = screen
      .getByRole('rowheader', { name: /Supply interruptions per year.*spread \(SD\)/ })
      .closest('tr')!;
    expect(within(row).getByText('|s| 0.032')).toBeInTheDocument();
    // −0.032 ± 1.96·0.021 = −0.073 to 0.009, across zero → 0 to 0.073.
    expect(within(row).getByText('0.000 to 0.073')).toBeInTheDocument();
    expect(screen.getByText(/Spreads are shown as \|s\|/)).toBeInTheDocument();
  });
});

describe('ImpliedCovariance', () => {
  it('shows covariance and correlation matrices with SEs and readable names', () => {
    render(<ImpliedCovariance results={results} />);
    const cov = screen.getByRole('table', { name: /covariance matrix/ });
    expect(within(cov).getAllByRole('columnheader', { name: 'River health: good' })).toHaveLength(
      1,
    );
    // Σ is symmetric: the covariance stands above and below the diagonal.
    expect(within(cov).getAllByText('0.240')).toHaveLength(2);
    expect(within(cov).getAllByText('SE 0.085')).toHaveLength(2);
    const cor = screen.getByRole('table', { name: /correlation matrix/ });
    expect(within(cor).getAllByText('1')).toHaveLength(2);
    expect(within(cor).getAllByText('0.600')).toHaveLength(2);
    expect(screen.queryByText(/river_good/)).toBeNull();
  });
});

describe('WtpTable', () => {
  it('gives every WTP its money, unit and basis and names the population kind', () => {
    render(<WtpTable results={results} />);
    expect(
      screen.getByText('€ of monthly bill increase per +1 in Supply interruptions per year'),
    ).toBeInTheDocument();
    expect(screen.getByRole('columnheader', { name: 'Population mean WTP' })).toBeInTheDocument();
    expect(screen.getByText('−€2.50')).toBeInTheDocument();
    expect(screen.getByText(/conditional-mean WTP is in Tastes/)).toBeInTheDocument();
  });
});

describe('FitStatistics', () => {
  it('names the draws as the run form does and counts choice observations, not tasks', () => {
    const fitted = {
      ...results,
      loglik: -100,
      loglikNull: -120,
      respondents: 10,
      observations: 80,
      parameters: 3,
      iterations: 12,
      convergence: { converged: true, gradientNorm: 1e-6 },
      converged: true,
      draws: { type: 'halton', count: 500, seed: 7 },
      data: { warmupTasksLeftOut: 0, holdoutTasks: 0 },
    } as unknown as RunResult;
    render(<FitStatistics results={fitted} />);
    expect(screen.getByText('500 scrambled Halton, seed 7')).toBeInTheDocument();
    expect(screen.getByText('Choice observations (respondent × task)')).toBeInTheDocument();
    expect(screen.queryByText('Choice tasks')).toBeNull();
  });
});

describe('describeRunStage and getConvergenceShare', () => {
  const run = (status: string, progress: object) => ({ status, progress }) as unknown as Run;
  it('names every stage, with the iteration while estimating', () => {
    expect(describeRunStage(run('queued', {}))).toBe('Waiting for a worker…');
    expect(describeRunStage(run('running', { stage: 'estimating', iteration: 12 }))).toBe(
      'Estimating: iteration 12',
    );
    expect(describeRunStage(run('running', { stage: 'standard_errors', iteration: 40 }))).toBe(
      'Computing standard errors…',
    );
    expect(describeRunStage(run('running', { stage: 'profiles' }))).toBe(
      'Computing taste profiles…',
    );
    expect(describeRunStage(run('running', { stage: 'saving' }))).toBe('Saving the results…');
  });
  it('keeps the bar near full after the optimisation', () => {
    const shares = ['standard_errors', 'wtp', 'profiles', 'saving'].map((stage) =>
      getConvergenceShare(run('running', { stage })),
    );
    expect(shares).toEqual([0.97, 0.98, 0.99, 1]);
  });
});

describe('a run taken up again after its worker was lost', () => {
  const run = (status: string, progress: object, attempts = 1) =>
    ({ status, progress, attempts, name: 'Mixed logit' }) as unknown as Run;
  it('says it waits to be taken up again while queued', () => {
    expect(describeRunStage(run('queued', { stage: 'estimating', iteration: 30 }))).toBe(
      'Waiting for a worker to take it up again after a worker restart…',
    );
    expect(describeRunStage(run('queued', {}, 0))).toBe('Waiting for a worker…');
  });
  it('says from which iteration it went on, and how many restarts there were', () => {
    expect(describeResume({})).toBeNull();
    expect(describeResume({ resumed: { attempt: 2, fromIteration: 17 } })).toBe(
      'Resumed from iteration 17 after a worker restart',
    );
    expect(describeResume({ resumed: { attempt: 3, fromIteration: 0 } })).toBe(
      'Started again from the beginning after a worker restart (2 restarts)',
    );
  });
  it('shows the note under the progress bar', () => {
    render(
      <RunProgress
        run={run('running', {
          stage: 'estimating',
          iteration: 21,
          resumed: { attempt: 2, fromIteration: 17 },
        })}
      />,
    );
    expect(
      screen.getByText('Resumed from iteration 17 after a worker restart'),
    ).toBeInTheDocument();
  });
});
