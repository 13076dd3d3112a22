// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import { DownloadList } from '@/features/exports/components/download-list';

afterEach(cleanup);

describe('DownloadList', () => {
  it('greys a link the run cannot give and says why, keeping the other links live', () => {
    const reason = 'This run has no cost coefficient, so it gives no WTP.';
    render(
      <DownloadList
        items={[
          {
            key: 'estimates',
            title: 'Estimates, WTP and fit',
            description: 'Tables',
            links: [
              { label: 'XLSX', href: '/x.xlsx' },
              { label: 'WTP CSV', href: '/x.csv?table=wtp', disabledReason: reason },
            ],
          },
        ]}
      />,
    );
    expect(screen.getByRole('link', { name: 'XLSX' })).toHaveAttribute('href', '/x.xlsx');
    const wtp = screen.getByRole('link', { name: 'WTP CSV' });
    expect(wtp).toHaveAttribute('aria-disabled', 'true');
    expect(wtp).not.toHaveAttribute('href');
    expect(screen.getByText(`WTP CSV: ${reason}`)).toBeInTheDocument();
  });

  it('hides every link of an item that is disabled as a whole', () => {
    render(
      <DownloadList
        items={[
          {
            key: 'profiles',
            title: 'Taste profiles',
            description: 'Rows',
            links: [{ label: 'CSV', href: '/p.csv' }],
            disabledReason: 'This run has no taste profiles (MNL).',
          },
        ]}
      />,
    );
    expect(screen.queryByRole('link')).toBeNull();
    expect(screen.getByText('This run has no taste profiles (MNL).')).toBeInTheDocument();
  });
});
