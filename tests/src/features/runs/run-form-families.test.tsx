// @vitest-environment jsdom
/** The run form's HB and latent class choices: their settings, defaults and field errors. */
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
  membershipQuestions: [
    {
      key: 'household_size',
      text: 'How many people live in your household?',
      type: 'number',
      optionCount: 0,
    },
    { key: 'filter_tap', text: 'Do you filter your tap water?', type: 'single', optionCount: 2 },
  ],
};

/** Renders the run form with `runOptions` and picks `model`; the user to go on with. */
async function renderWithModel(model: string, runOptions: RunOptions = options) {
  renderWithQuery(<RunForm teamId="t" studyId="s" options={runOptions} />);
  const user = userEvent.setup();
  await user.selectOptions(screen.getByLabelText('Model'), model);
  return user;
}

/**
 * Picks the model, enters `value` in the field labelled `label` (in place of what it held) and
 * starts the run: the field's `message` shows and no request is sent.
 */
async function expectRefusedEntry(model: string, label: string, value: string, message: string) {
  const { requests } = fakeFetch();
  const user = await renderWithModel(model);
  await user.clear(screen.getByLabelText(label));
  await user.type(screen.getByLabelText(label), value);
  await user.click(screen.getByRole('button', { name: 'Start run' }));
  expect(await screen.findByText(message)).toBeInTheDocument();
  expect(requests).toHaveLength(0);
}

describe('RunForm with hierarchical Bayes', () => {
  it('sends the sampler settings, the prior and correlation, and notes how coding meets the prior', async () => {
    const { requests } = fakeFetch({ status: 201, body: { id: 'r1' } });
    const user = await renderWithModel('hb');
    expect(screen.getByText(/The priors act on the coefficients as coded/)).toBeInTheDocument();
    expect(screen.queryByText('Estimation settings')).not.toBeInTheDocument();
    // HB offers no triangular or uniform tastes.
    const river = screen.getByLabelText('Distribution of River health: good');
    expect(river).toHaveValue('normal');
    expect(river.querySelector('option[value="triangular"]')).toBeNull();
    await user.clear(screen.getByLabelText('Iterations per chain'));
    await user.type(screen.getByLabelText('Iterations per chain'), '4000');
    await user.type(screen.getByLabelText('Burn-in'), '1000');
    expect(screen.getByLabelText('MH steps per respondent')).toHaveValue(5);
    expect(
      screen.getByText(
        /Defaults: 40,000 iterations per chain with the first half as burn-in, every 20th draw kept, 5 MH steps per respondent per iteration, 2 chains/,
      ),
    ).toBeInTheDocument();
    await user.clear(screen.getByLabelText('MH steps per respondent'));
    await user.type(screen.getByLabelText('MH steps per respondent'), '3');
    await user.selectOptions(screen.getByLabelText('Prior on the covariance Σ'), 'train');
    await user.click(screen.getByLabelText('Correlated random tastes'));
    await user.click(screen.getByRole('button', { name: 'Start run' }));
    await waitFor(() => expect(requests).toHaveLength(1));
    expect(requests[0].body).toMatchObject({
      spec: {
        model: 'hb',
        correlated: true,
        cost: 'bill',
        mcmc: { iterations: 4000, burnin: 1000, thin: 20, steps: 3, chains: 2, seed: 1 },
        priors: { preset: 'train', muVariance: 100 },
      },
    });
  });

  it('when the MH steps are 0, shows the field error and sends nothing', async () => {
    await expectRefusedEntry('hb', 'MH steps per respondent', '0', 'Use at least 1 step');
  });

  it('when the burn-in is as long as the iterations, shows the field error and sends nothing', async () => {
    await expectRefusedEntry(
      'hb',
      'Burn-in',
      '40000',
      'Burn-in must be shorter than the iterations',
    );
  });
});

describe('RunForm with latent class', () => {
  it('sends a class range with fixed coefficients and ten starts', async () => {
    const { requests } = fakeFetch({ status: 201, body: { id: 'r1' } });
    const user = await renderWithModel('latent_class');
    expect(screen.getByLabelText('Distribution of River health: good')).toHaveValue('fixed');
    expect(screen.getByLabelText('EM starts per class count')).toHaveValue(10);
    await user.click(screen.getByRole('button', { name: 'Start run' }));
    await waitFor(() => expect(requests).toHaveLength(1));
    const spec = (requests[0].body as { spec: Record<string, unknown> }).spec;
    expect(spec).toMatchObject({ model: 'latent_class', classes: [2, 4], starts: 10 });
    expect(spec).not.toHaveProperty('mcmc');
    expect(spec).not.toHaveProperty('membership');
  });

  it('sends the background questions picked for class membership, and states the coding', async () => {
    const { requests } = fakeFetch({ status: 201, body: { id: 'r1' } });
    const user = await renderWithModel('latent_class');
    const group = screen.getByRole('group', { name: 'Class membership depends on (optional)' });
    expect(group).toHaveAccessibleDescription(/a “not answered” column is added/);
    await user.click(screen.getByRole('checkbox', { name: /Do you filter your tap water/ }));
    await user.click(screen.getByRole('checkbox', { name: /How many people live/ }));
    await user.click(screen.getByRole('button', { name: 'Start run' }));
    await waitFor(() => expect(requests).toHaveLength(1));
    const spec = (requests[0].body as { spec: Record<string, unknown> }).spec;
    expect(spec.membership).toEqual(['household_size', 'filter_tap']);
  });

  it('when the server refuses a membership question, shows its message at the questions', async () => {
    fakeFetch(
      fieldRefusal(
        400,
        'invalid_input',
        'Everyone in this run gave the same answer to filter_tap',
        [
          {
            path: 'spec.membership.0',
            message: 'The questionnaire has no background question filter_tap',
          },
        ],
      ),
    );
    const user = await renderWithModel('latent_class');
    await user.click(screen.getByRole('checkbox', { name: /Do you filter your tap water/ }));
    await user.click(screen.getByRole('button', { name: 'Start run' }));
    expect(
      await screen.findByText('The questionnaire has no background question filter_tap'),
    ).toBeInTheDocument();
  });

  it('says so when the study has no usable background questions', async () => {
    fakeFetch();
    await renderWithModel('latent_class', { ...options, membershipQuestions: [] });
    expect(screen.getByText(/no single-choice or number background questions/)).toBeInTheDocument();
    expect(screen.queryAllByRole('checkbox', { name: /household|tap water/ })).toHaveLength(0);
  });

  it('when the range is reversed, shows the error on the class fields and sends nothing', async () => {
    await expectRefusedEntry(
      'latent_class',
      'Fewest classes',
      '5',
      'Give the range as [fewest, most] classes',
    );
  });
});
