// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { TastesFilters } from '@/features/tastes/components/tastes-filters';
import type { TasteHeader } from '@shared/schemas/tastes';
import type { TastesQuery } from '@/features/tastes/api/list-tastes';
import { mixedTastesRun } from './taste-fixtures';

afterEach(cleanup);

const header: TasteHeader = {
  run: mixedTastesRun,
  coefficients: [],
  wtp: [],
  cost: null,
  costUnit: '€',
  questions: [],
  tasks: [],
  personalColumns: false,
  lowDrawsThreshold: 50,
};

const query: TastesQuery = { runId: 'run1', sort: 'number', dir: 'asc', page: 1, pageSize: 25 };

describe('TastesFilters', () => {
  it('filters on a yes/no property both ways and back to all respondents, from page 1', async () => {
    const onChange = vi.fn();
    const { rerender } = render(
      <TastesFilters header={header} query={{ ...query, page: 3 }} onChange={onChange} />,
    );
    const flags = screen.getByLabelText('Quality flags');
    expect(flags).toHaveValue('');
    await userEvent.selectOptions(flags, 'Only unflagged');
    expect(onChange).toHaveBeenLastCalledWith({ flagged: false, page: 1 });
    await userEvent.selectOptions(screen.getByLabelText('Effective draws'), 'Only few draws');
    expect(onChange).toHaveBeenLastCalledWith({ lowDraws: true, page: 1 });

    rerender(
      <TastesFilters header={header} query={{ ...query, flagged: true }} onChange={onChange} />,
    );
    expect(screen.getByLabelText('Quality flags')).toHaveValue('true');
    await userEvent.selectOptions(screen.getByLabelText('Quality flags'), 'All respondents');
    expect(onChange).toHaveBeenLastCalledWith({ flagged: undefined, page: 1 });
  });
});
