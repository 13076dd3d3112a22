// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router';
import { TastesTable } from '@/features/tastes/components/tastes-table';
import type { TasteList, TasteRow } from '@shared/schemas/tastes';
import type { TastesQuery } from '@/features/tastes/api/list-tastes';
import { mixedTastesRun } from './taste-fixtures';

afterEach(cleanup);

const row = (n: number, extra: Partial<TasteRow> = {}): TasteRow => ({
  respondentId: `r${n}`,
  number: n,
  block: 1,
  flags: [],
  mean: { bill: -0.2 * n, river_good: n, asc: -0.4 },
  sd: { bill: 0.05, river_good: 0.5, asc: 0 },
  wtp: { river_good: 5 * n },
  effectiveDraws: 100,
  lowDraws: false,
  answers: { age_band: '18–34' },
  ...extra,
});

function makeList(personal: boolean): TasteList {
  return {
    run: mixedTastesRun,
    coefficients: [
      {
        name: 'bill',
        label: 'Monthly bill',
        distribution: 'neg_lognormal',
        populationMean: -0.3,
        populationSd: 0.1,
        location: -1.3,
        spread: 0.4,
      },
      {
        name: 'river_good',
        label: 'River good',
        distribution: 'normal',
        populationMean: 1,
        populationSd: 0.8,
        location: 1,
        spread: 0.8,
      },
      {
        name: 'asc',
        label: 'Status quo',
        distribution: 'fixed',
        populationMean: -0.4,
        populationSd: 0,
        location: -0.4,
        spread: 0,
      },
    ],
    wtp: ['river_good'],
    cost: 'bill',
    costUnit: '€',
    questions: [
      { key: 'age_band', text: 'Age band', type: 'single', options: [], personal: false },
    ],
    tasks: [],
    personalColumns: personal,
    lowDrawsThreshold: 30,
    page: 2,
    pageSize: 25,
    total: 30,
    rows: [
      row(1, personal ? { externalId: 'EXT-1' } : {}),
      row(2, { lowDraws: true, effectiveDraws: 12, flags: ['speeder'] }),
    ],
  };
}

const query: TastesQuery = { runId: 'run1', page: 2, pageSize: 25, sort: 'mean:bill', dir: 'asc' };

function renderTable(personal: boolean, onChange = vi.fn()) {
  render(
    <MemoryRouter>
      <TastesTable
        data={makeList(personal)}
        query={query}
        onChange={onChange}
        respondentHref={(id) => `/respondents/${id}`}
      />
    </MemoryRouter>,
  );
  return onChange;
}

describe('TastesTable', () => {
  it('shows each conditional mean with its SD beside it and flags few effective draws', () => {
    renderTable(false);
    const table = screen.getByRole('table');
    const rows = within(table).getAllByRole('row');
    expect(rows[1]).toHaveTextContent('−0.200± 0.050');
    expect(rows[2]).toHaveTextContent('few draws12');
    expect(rows[2]).toHaveTextContent('speeder');
    expect(within(table).getByRole('columnheader', { name: /^Status quo/ })).toHaveTextContent(
      'fixed',
    );
    expect(within(table).getByRole('link', { name: '#2' })).toHaveAttribute(
      'href',
      '/respondents/r2',
    );
  });

  it('leaves the external id column out without personal columns, and shows it with them', () => {
    renderTable(false);
    expect(screen.queryByRole('columnheader', { name: 'External id' })).toBeNull();
    cleanup();
    renderTable(true);
    expect(screen.getByRole('columnheader', { name: 'External id' })).toBeInTheDocument();
    expect(screen.getByText('EXT-1')).toBeInTheDocument();
  });

  it('sorts on the server: a header click flips the direction of the current sort', async () => {
    const onChange = renderTable(false);
    const user = userEvent.setup();
    expect(screen.getByRole('columnheader', { name: /Monthly bill/ })).toHaveAttribute(
      'aria-sort',
      'ascending',
    );
    await user.click(screen.getByRole('button', { name: /Monthly bill/ }));
    expect(onChange).toHaveBeenLastCalledWith({ sort: 'mean:bill', dir: 'desc', page: 1 });
    await user.click(screen.getByRole('button', { name: /^River good/ }));
    expect(onChange).toHaveBeenLastCalledWith({ sort: 'mean:river_good', dir: 'asc', page: 1 });
  });

  it('pages: 30 rows of 25 make two pages, and the last page has no Next', async () => {
    const onChange = renderTable(false);
    const pages = screen.getByRole('navigation', { name: 'Pages' });
    expect(pages).toHaveTextContent('30 respondents · page 2 of 2');
    expect(within(pages).getByRole('button', { name: 'Next' })).toBeDisabled();
    await userEvent.setup().click(within(pages).getByRole('button', { name: 'Previous' }));
    expect(onChange).toHaveBeenLastCalledWith({ page: 1 });
  });
});
