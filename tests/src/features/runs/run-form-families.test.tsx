// @vitest-environment jsdom
/** The run form's HB and latent class choices: their settings, defaults and field errors. */
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { RunOptions } from '@shared/schemas/run';
import { RunForm } from '@/features/runs/components/run-form';
import { fakeFetch, renderWithQuery } from '../../support/render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const options: RunOptions = {
  columns: [
    {
      key: 'attr:bill',
      code: 'bill',
      label: 'Monthly bill increase (€)',
      kind: 'linear',
      attributeId: 'bill',
      isCost: true,
    },
    {
      key: 'attr:river:good',
      code: 'river_good',
      label: 'River health: good',
      kind: 'level',
      attributeId: 'river',
      isCost: false,
    },
    {
      key: 'attr:renew:r80',
      code: 'renew_80',
      label: 'Renewable pumping: 80 %',
      kind: 'level',
      attributeId: 'renew',
      isCost: false,
    },
    {
      key: 'asc:fixed',
      code: 'asc_current',
      label: 'Constant: Current service',
      kind: 'constant',
      attributeId: null,
      isCost: false,
    },
  ],
  includedRespondents: 120,
  filters: [],
  hasRuns: true,
};

describe('RunForm with hierarchical Bayes', () => {
  it('sends the sampler settings, the prior and correlation, and notes how coding meets the prior', async () => {
    const { requests } = fakeFetch({ status: 201, body: { id: 'r1' } });
    renderWithQuery(<RunForm teamId="t" studyId="s" options={options} />);
    const user = userEvent.setup();
    await user.selectOptions(screen.getByLabelText('Model'), 'hb');
    expect(screen.getByText(/The priors act on the coefficients as coded/)).toBeInTheDocument();
    expect(screen.queryByText('Estimation settings')).not.toBeInTheDocument();
    // HB offers no triangular or uniform tastes.
    const river = screen.getByLabelText('Distribution of River health: good');
    expect(river).toHaveValue('normal');
    expect(river.querySelector('option[value="triangular"]')).toBeNull();
    await user.clear(screen.getByLabelText('Iterations per chain'));
    await user.type(screen.getByLabelText('Iterations per chain'), '4000');
    await user.type(screen.getByLabelText('Burn-in'), '1000');
    await user.selectOptions(screen.getByLabelText('Prior on the covariance Σ'), 'train');
    await user.click(screen.getByLabelText('Correlated random tastes'));
    await user.click(screen.getByRole('button', { name: 'Start run' }));
    await waitFor(() => expect(requests).toHaveLength(1));
    expect(requests[0].body).toMatchObject({
      spec: {
        model: 'hb',
        correlated: true,
        cost: 'bill',
        mcmc: { iterations: 4000, burnin: 1000, thin: 10, chains: 2, seed: 1 },
        priors: { preset: 'train', muVariance: 100 },
      },
    });
  });

  it('when the burn-in is as long as the iterations, shows the field error and sends nothing', async () => {
    const { requests } = fakeFetch();
    renderWithQuery(<RunForm teamId="t" studyId="s" options={options} />);
    const user = userEvent.setup();
    await user.selectOptions(screen.getByLabelText('Model'), 'hb');
    await user.type(screen.getByLabelText('Burn-in'), '20000');
    await user.click(screen.getByRole('button', { name: 'Start run' }));
    expect(
      await screen.findByText('Burn-in must be shorter than the iterations'),
    ).toBeInTheDocument();
    expect(requests).toHaveLength(0);
  });
});

describe('RunForm with latent class', () => {
  it('sends a class range with fixed coefficients and ten starts', async () => {
    const { requests } = fakeFetch({ status: 201, body: { id: 'r1' } });
    renderWithQuery(<RunForm teamId="t" studyId="s" options={options} />);
    const user = userEvent.setup();
    await user.selectOptions(screen.getByLabelText('Model'), 'latent_class');
    expect(screen.getByLabelText('Distribution of River health: good')).toHaveValue('fixed');
    expect(screen.getByLabelText('EM starts per class count')).toHaveValue(10);
    await user.click(screen.getByRole('button', { name: 'Start run' }));
    await waitFor(() => expect(requests).toHaveLength(1));
    const spec = (requests[0].body as { spec: Record<string, unknown> }).spec;
    expect(spec).toMatchObject({ model: 'latent_class', classes: [2, 4], starts: 10 });
    expect(spec).not.toHaveProperty('mcmc');
  });

  it('when the range is reversed, shows the error on the class fields and sends nothing', async () => {
    const { requests } = fakeFetch();
    renderWithQuery(<RunForm teamId="t" studyId="s" options={options} />);
    const user = userEvent.setup();
    await user.selectOptions(screen.getByLabelText('Model'), 'latent_class');
    await user.clear(screen.getByLabelText('Fewest classes'));
    await user.type(screen.getByLabelText('Fewest classes'), '5');
    await user.click(screen.getByRole('button', { name: 'Start run' }));
    expect(await screen.findByText('Give the range as [fewest, most] classes')).toBeInTheDocument();
    expect(requests).toHaveLength(0);
  });
});
