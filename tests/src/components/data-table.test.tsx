// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import { DataTable, figureHeading } from '@/components/ui/data-table';

afterEach(cleanup);

describe('DataTable', () => {
  it('names the table by its caption and gives each shown column a heading', () => {
    render(
      <DataTable
        caption="Completes per block"
        headings={['Block', false, figureHeading('Completes')]}
      >
        <tr>
          <td>1</td>
          <td>12</td>
        </tr>
      </DataTable>,
    );
    const table = screen.getByRole('table', { name: 'Completes per block' });
    const headings = within(table).getAllByRole('columnheader');
    expect(headings.map((h) => h.textContent)).toEqual(['Block', 'Completes']);
    expect(headings[1]).toHaveClass('text-right');
    expect(within(table).getAllByRole('row')).toHaveLength(2);
  });

  it('says the empty text in one row across every shown column, and nothing when given false', () => {
    const { rerender } = render(
      <DataTable label="Versions" headings={['Version', 'Frozen', false]} empty="None yet">
        {null}
      </DataTable>,
    );
    expect(screen.getByRole('cell', { name: 'None yet' })).toHaveAttribute('colspan', '2');
    rerender(
      <DataTable label="Versions" headings={['Version', 'Frozen']} empty={false}>
        {null}
      </DataTable>,
    );
    expect(screen.queryByRole('cell')).toBeNull();
  });
});
