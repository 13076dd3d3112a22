// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { RunOptions } from '@shared/schemas/run';
import { RunForm } from '@/features/runs/components/run-form';
import { fakeFetch, fieldRefusal, renderWithQuery } from '../../support/render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const options = (hasRuns: boolean): RunOptions => ({
  columns: [
    {
      key: 'attr:bill',
      code: 'monthly_bill_increase',
      label: 'Monthly bill increase (€)',
      kind: 'linear',
      attributeId: 'bill',
      isCost: true,
    },
    {
      key: 'attr:river:good',
      code: 'river_health_good',
      label: 'River health: good',
      kind: 'level',
      attributeId: 'river',
      isCost: false,
    },
    {
      key: 'asc:fixed',
      code: 'asc_current_service',
      label: 'Constant: Current service',
      kind: 'constant',
      attributeId: null,
      isCost: false,
    },
  ],
  includedRespondents: 120,
  filters: [{ id: '5b0b7a8e-2f7c-4b8e-9d2a-0c1e2f3a4b5c', name: 'Tap filterers' }],
  hasRuns,
  membershipQuestions: [],
});

const run = { id: 'r1', name: 'x', status: 'queued' };

describe('RunForm', () => {
  it('proposes an MNL with every column for a first run and sends it', async () => {
    const { requests } = fakeFetch({ status: 201, body: run });
    const onStarted = vi.fn();
    renderWithQuery(
      <RunForm teamId="t" studyId="s" options={options(false)} onStarted={onStarted} />,
    );
    expect(screen.getByLabelText('Model')).toHaveValue('mnl');
    await userEvent.setup().click(screen.getByRole('button', { name: 'Start run' }));
    await waitFor(() => expect(onStarted).toHaveBeenCalled());
    expect(requests[0].url).toBe('/api/teams/t/studies/s/runs');
    expect(requests[0].body).toMatchObject({
      spec: {
        model: 'mnl',
        cost: 'monthly_bill_increase',
        coefficients: [
          { name: 'monthly_bill_increase', column: 'attr:bill', distribution: 'fixed' },
          { name: 'river_health_good', column: 'attr:river:good', distribution: 'fixed' },
          { name: 'asc_current_service', column: 'asc:fixed', distribution: 'fixed' },
        ],
        correlated: false,
      },
      respondents: { filterId: null },
    });
  });

  it('proposes a mixed logit with normal tastes and a negative lognormal cost after a first run', async () => {
    const { requests } = fakeFetch({ status: 201, body: run });
    renderWithQuery(<RunForm teamId="t" studyId="s" options={options(true)} />);
    expect(screen.getByLabelText('Model')).toHaveValue('mixed');
    expect(screen.getByLabelText('Distribution of Monthly bill increase (€)')).toHaveValue(
      'neg_lognormal',
    );
    expect(screen.getByLabelText('Distribution of River health: good')).toHaveValue('normal');
    expect(screen.getByLabelText('Distribution of Constant: Current service')).toHaveValue('fixed');
    const user = userEvent.setup();
    await user.selectOptions(screen.getByLabelText('Respondents'), 'Saved filter: Tap filterers');
    await user.click(screen.getByRole('button', { name: 'Start run' }));
    await waitFor(() => expect(requests).toHaveLength(1));
    expect(requests[0].body).toMatchObject({
      spec: { model: 'mixed', draws: { type: 'halton', count: 500, seed: 1 }, profileDraws: 2000 },
      respondents: { filterId: '5b0b7a8e-2f7c-4b8e-9d2a-0c1e2f3a4b5c' },
    });
  });

  it('sends the estimation settings: WTP space, the covariance choice and an iteration limit', async () => {
    const { requests } = fakeFetch({ status: 201, body: run });
    renderWithQuery(<RunForm teamId="t" studyId="s" options={options(true)} />);
    const user = userEvent.setup();
    await user.click(screen.getByText('Estimation settings'));
    await user.selectOptions(screen.getByLabelText('Space'), 'wtp');
    await user.selectOptions(screen.getByLabelText('Covariance for intervals'), 'classical');
    await user.type(screen.getByLabelText('Iteration limit per start'), '500');
    await user.click(screen.getByRole('button', { name: 'Start run' }));
    await waitFor(() => expect(requests).toHaveLength(1));
    expect(requests[0].body).toMatchObject({
      spec: {
        space: 'wtp',
        starts: 3,
        settings: { covariance: 'classical', maxIterations: 500, tolerance: 1e-7 },
      },
    });
  });

  it('when the draws are too few, shows the field error and sends nothing', async () => {
    const { requests } = fakeFetch();
    renderWithQuery(<RunForm teamId="t" studyId="s" options={options(true)} />);
    const user = userEvent.setup();
    await user.clear(screen.getByLabelText('Draws per respondent'));
    await user.type(screen.getByLabelText('Draws per respondent'), '3');
    await user.click(screen.getByRole('button', { name: 'Start run' }));
    expect(await screen.findByText('Use at least 10 draws')).toBeInTheDocument();
    expect(requests).toHaveLength(0);
  });

  it('when an MNL is switched back, random choices fall back to fixed', async () => {
    renderWithQuery(<RunForm teamId="t" studyId="s" options={options(true)} />);
    await userEvent.setup().selectOptions(screen.getByLabelText('Model'), 'mnl');
    expect(screen.getByLabelText('Distribution of Monthly bill increase (€)')).toHaveValue('fixed');
  });

  it("puts the server's field error on the coefficient it names", async () => {
    fakeFetch(
      fieldRefusal(400, 'invalid_input', 'The study has no coded column attr:river:good', [
        {
          path: 'spec.coefficients.1.column',
          message: 'The study has no coded column attr:river:good',
        },
      ]),
    );
    renderWithQuery(<RunForm teamId="t" studyId="s" options={options(false)} />);
    await userEvent.setup().click(screen.getByRole('button', { name: 'Start run' }));
    const select = screen.getByLabelText('Distribution of River health: good');
    await waitFor(() => expect(select).toHaveAttribute('aria-invalid', 'true'));
  });
});
