// @vitest-environment jsdom
/** Segments of a latent class run: split by the likeliest class by default, no question asked. */
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor } from '@testing-library/react';
import type { Segments, TasteHeader } from '@shared/schemas/tastes';
import { SegmentsPanel } from '@/features/tastes/components/segments-panel';
import { fakeFetch, renderWithQuery } from '../../support/render';

// Charts need a canvas, which jsdom lacks; the panel's table is what is checked here.
vi.mock('@/features/tastes/components/segments-chart', () => ({ SegmentsChart: () => null }));

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const header = (model: TasteHeader['run']['model']): TasteHeader => ({
  run: {
    id: 'run1',
    name: 'LC',
    model,
    finishedAt: null,
    profiles: 80,
    profileDraws: null,
    erasedRespondents: 0,
    wtpUnavailable: null,
  },
  coefficients: [
    {
      name: 'river_good',
      label: 'River good',
      distribution: 'fixed',
      populationMean: 1,
      populationSd: 0.5,
      location: 1,
      spread: 0,
    },
  ],
  wtp: [],
  cost: null,
  costUnit: '',
  questions: [],
  tasks: [{ task: 1, block: 1 }],
  personalColumns: false,
  lowDrawsThreshold: 0,
});

const group = (key: string, count: number, mean: number) => ({
  key,
  label: `Class ${key} (${key === '1' ? 60 : 40} %)`,
  count,
  mean,
  sd: 0,
  min: mean,
  q1: mean,
  median: mean,
  q3: mean,
  max: mean,
  histogram: [count],
});

describe('SegmentsPanel for a latent class run', () => {
  it('asks for the likeliest-class split and shows one row per class', async () => {
    const segments: Segments = {
      coefficient: header('latent_class').coefficients[0],
      groupLabel: 'Likeliest latent class',
      edges: [0, 2],
      groups: [group('1', 48, 1.4), group('2', 32, 0.2)],
      ungrouped: 0,
    };
    const { requests } = fakeFetch({ status: 200, body: segments });
    renderWithQuery(<SegmentsPanel teamId="t" studyId="s" header={header('latent_class')} />);
    expect(screen.getByLabelText('Split by')).toHaveValue('class');
    expect(screen.queryByLabelText('Question')).not.toBeInTheDocument();
    expect(screen.queryByLabelText('Task')).not.toBeInTheDocument();
    await waitFor(() => expect(screen.getByText('Class 2 (40 %)')).toBeInTheDocument());
    expect(requests[0].url).toMatch(/segments\?.*groupBy=class/);
    expect(screen.getByText(/Posterior-weighted means of River good by/)).toBeInTheDocument();
  });

  it('offers no class split for another family', () => {
    fakeFetch();
    renderWithQuery(<SegmentsPanel teamId="t" studyId="s" header={header('hb')} />);
    const split = screen.getByLabelText('Split by');
    expect(split).toHaveValue('task');
    expect(split.querySelector('option[value="class"]')).toBeNull();
  });
});
