// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { DesignComparison } from '@/features/design/components/design-comparison';
import { buildDesignSpec, defaultDesignForm } from '@/features/design/utils/build-design-spec';

afterEach(cleanup);

const comparison = [
  { criterion: 'd_error' as const, current: 0.05, candidate: 0.04, unavailable: null },
  { criterion: 'a_error' as const, current: null, candidate: 0.5, unavailable: null },
  {
    criterion: 'c_error' as const,
    current: null,
    candidate: null,
    unavailable: 'The C-error needs a cost attribute with linear coding (Attributes).',
  },
];

describe('DesignComparison', () => {
  it('shows both designs per criterion with the change, and says what adopting does live', async () => {
    const onAdopt = vi.fn();
    const onKeep = vi.fn();
    render(
      <DesignComparison
        comparison={comparison}
        status="live"
        currentVersion={3}
        canDecide
        busy={false}
        onAdopt={onAdopt}
        onKeep={onKeep}
      />,
    );
    const table = screen.getByRole('table', { name: 'Design comparison' });
    const d = within(table).getByRole('row', { name: /D-error/ });
    expect(d).toHaveTextContent('0.05000');
    expect(d).toHaveTextContent('0.04000');
    expect(d).toHaveTextContent('−20 %');
    expect(within(table).getByRole('row', { name: /A-error/ })).toHaveTextContent('—');
    expect(within(table).getByRole('row', { name: /C-error/ })).toHaveTextContent(
      /needs a cost attribute/,
    );
    expect(screen.getByText(/version 4 of this live study/)).toBeInTheDocument();
    await userEvent.click(screen.getByRole('button', { name: 'Adopt the new design' }));
    await userEvent.click(screen.getByRole('button', { name: 'Keep the current design' }));
    expect(onAdopt).toHaveBeenCalledOnce();
    expect(onKeep).toHaveBeenCalledOnce();
  });

  it('for readers, shows the comparison without the decision buttons', () => {
    render(
      <DesignComparison
        comparison={comparison}
        status="closed"
        currentVersion={1}
        canDecide={false}
        busy={false}
        onAdopt={() => {}}
        onKeep={() => {}}
      />,
    );
    expect(screen.queryByRole('button')).toBeNull();
    expect(screen.queryByText(/live study/)).toBeNull();
  });
});

describe('buildDesignSpec with a criterion and the priors source', () => {
  it('keeps the criterion, the t-value and the run the priors came from', () => {
    const source = { runId: '8b8f4c2e-2f7a-4a5e-9a43-3c1f0f7d2b11', spread: 'se' as const };
    const out = buildDesignSpec(
      {
        ...defaultDesignForm,
        priorsKind: 'fixed',
        criterion: 's_estimate',
        tValue: '2.58',
        priorsSource: source,
        priors: { 'attr:bill': { mean: '-0.1', sd: '0' } },
      },
      [
        {
          key: 'attr:bill',
          name: 'Monthly bill increase (€)',
          kind: 'linear',
          attributeId: 'bill',
        },
      ],
    );
    expect(out).toEqual({
      ok: true,
      spec: expect.objectContaining({
        criterion: 's_estimate',
        tValue: 2.58,
        priorsSource: source,
      }),
    });
  });
});
