// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { StudyDefinition } from '@shared/schemas/study-definition';
import { ChoiceTaskCard } from '@/components/choice-task/choice-task-card';

afterEach(cleanup);

const definition: StudyDefinition = {
  attributes: [
    {
      id: 'bill',
      name: 'Monthly bill increase',
      kind: 'numeric',
      unit: '€',
      isCost: true,
      coding: 'linear',
      levels: [
        { id: 'b0', label: '', value: 0 },
        { id: 'b6', label: '', value: 6 },
      ],
    },
    {
      id: 'river',
      name: 'River health rating',
      description: 'The state of the river downstream.',
      kind: 'categorical',
      isCost: false,
      coding: 'dummy',
      levels: [
        { id: 'poor', label: 'Poor' },
        { id: 'good', label: 'Good' },
      ],
    },
  ],
  alternatives: { count: 2, labeled: false, labels: [] },
  fixedAlternative: {
    kind: 'status_quo',
    label: 'Keep the current service',
    levels: { bill: 'b0', river: 'poor' },
  },
  excludedCombinations: [],
};

const alternatives = [
  { kind: 'designed' as const, designIndex: 0, levels: { bill: 'b6', river: 'good' } },
  { kind: 'designed' as const, designIndex: 1, levels: { bill: 'b0', river: 'poor' } },
  { kind: 'fixed' as const },
];

describe('ChoiceTaskCard', () => {
  it('shows every alternative with formatted levels, the status quo last', () => {
    render(<ChoiceTaskCard definition={definition} alternatives={alternatives} />);
    const radios = screen.getAllByRole('radio');
    expect(radios.map((r) => r.getAttribute('aria-label'))).toEqual([
      'Option A',
      'Option B',
      'Keep the current service',
    ]);
    expect(within(radios[0]).getByText('€6')).toBeInTheDocument();
    expect(within(radios[0]).getByText('Good')).toBeInTheDocument();
    expect(within(radios[2]).getByText('€0')).toBeInTheDocument();
    expect(screen.getByText('The state of the river downstream.')).toBeInTheDocument();
  });

  it('chooses by tap and by keyboard, and marks the selected card', async () => {
    const onChoose = vi.fn();
    const { rerender } = render(
      <ChoiceTaskCard definition={definition} alternatives={alternatives} onChoose={onChoose} />,
    );
    await userEvent.click(screen.getByRole('radio', { name: 'Option B' }));
    screen.getByRole('radio', { name: 'Keep the current service' }).focus();
    await userEvent.keyboard('{Enter}');
    expect(onChoose.mock.calls).toEqual([[1], [2]]);
    rerender(
      <ChoiceTaskCard
        definition={definition}
        alternatives={alternatives}
        onChoose={onChoose}
        selectedIndex={1}
      />,
    );
    expect(screen.getByRole('radio', { name: 'Option B' })).toHaveAttribute('aria-checked', 'true');
    expect(screen.getByRole('radio', { name: 'Option A' })).toHaveAttribute(
      'aria-checked',
      'false',
    );
  });

  it('labeled alternatives use their names and mark omitted attributes as not applying', () => {
    render(
      <ChoiceTaskCard
        definition={{
          ...definition,
          fixedAlternative: { kind: 'opt_out', label: 'None of these', levels: {} },
          alternatives: {
            count: 2,
            labeled: true,
            labels: [
              { id: 'mains', name: 'Mains upgrade', omittedAttributeIds: [] },
              { id: 'tank', name: 'Home tank', omittedAttributeIds: ['river'] },
            ],
          },
        }}
        alternatives={[
          { kind: 'designed', designIndex: 0, levels: { bill: 'b0', river: 'good' } },
          { kind: 'designed', designIndex: 1, levels: { bill: 'b6' } },
          { kind: 'fixed' },
        ]}
      />,
    );
    const tank = screen.getByRole('radio', { name: 'Home tank' });
    expect(within(tank).getByText('does not apply')).toBeInTheDocument();
    expect(screen.getByRole('radio', { name: 'None of these' })).toBeInTheDocument();
  });
});
