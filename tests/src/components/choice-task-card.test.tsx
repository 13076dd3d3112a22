// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { StudyDefinition } from '@shared/schemas/study-definition';
import {
  makeStudyDefinition,
  numericLevels,
  riverRating,
} from '../../../scripts/lib/study-factory/definition';
import { ChoiceTaskCard } from '@/components/choice-task/choice-task-card';

afterEach(cleanup);

const definition: StudyDefinition = makeStudyDefinition({
  only: ['bill', 'river'],
  attributes: {
    bill: { levels: numericLevels('b', [0, 6], () => '') },
    river: { ...riverRating(['Poor', 'Good']), description: 'The state of the river downstream.' },
  },
  fixedAlternative: {
    kind: 'status_quo',
    label: 'Keep the current service',
    levels: { bill: 'b0', river: 'poor' },
  },
});

const alternatives = [
  { kind: 'designed' as const, designIndex: 0, levels: { bill: 'b6', river: 'good' } },
  { kind: 'designed' as const, designIndex: 1, levels: { bill: 'b0', river: 'poor' } },
  { kind: 'fixed' as const },
];

/** The alternatives' titles: the column headers of the table's head. */
const columnTitles = () =>
  within(screen.getAllByRole('rowgroup')[0])
    .getAllByRole('columnheader')
    .map((h) => h.textContent);

describe('ChoiceTaskCard', () => {
  it('puts the alternatives side by side as columns with attributes as rows, status quo last', () => {
    render(<ChoiceTaskCard definition={definition} alternatives={alternatives} />);
    expect(columnTitles()).toEqual(['Option A', 'Option B', 'Keep the current service']);
    const rows = screen.getAllByRole('row');
    const values = rows.map((r) =>
      within(r)
        .queryAllByRole('cell')
        .map((c) => c.textContent),
    );
    expect(values).toContainEqual(['€6', '€0', '€0']);
    expect(values).toContainEqual(['Good', 'Poor', 'Poor']);
    expect(screen.getAllByRole('radio').map((r) => r.getAttribute('value'))).toEqual([
      '0',
      '1',
      '2',
    ]);
    expect(screen.getByRole('radio', { name: 'Option A' })).toHaveAccessibleDescription(
      'Monthly bill increase: €6; River health rating: Good',
    );
  });

  it('opens attribute help in place, under the attribute name', async () => {
    render(<ChoiceTaskCard definition={definition} alternatives={alternatives} />);
    const help = screen.getByText('The state of the river downstream.');
    expect(help).not.toBeVisible();
    await userEvent.click(
      screen.getByRole('button', { name: /What is this.*River health rating/ }),
    );
    expect(help).toBeVisible();
  });

  it('chooses by tapping a column or its radio button, and by the arrow keys', async () => {
    const onChoose = vi.fn();
    const { rerender } = render(
      <ChoiceTaskCard definition={definition} alternatives={alternatives} onChoose={onChoose} />,
    );
    await userEvent.click(screen.getByRole('radio', { name: 'Option B' }));
    await userEvent.click(screen.getByText('€6'));
    expect(onChoose.mock.calls).toEqual([[1], [0]]);
    rerender(
      <ChoiceTaskCard
        definition={definition}
        alternatives={alternatives}
        onChoose={onChoose}
        selectedIndex={1}
      />,
    );
    expect(screen.getByRole('radio', { name: 'Option B' })).toBeChecked();
    expect(screen.getByRole('radio', { name: 'Option A' })).not.toBeChecked();
    screen.getByRole('radio', { name: 'Option B' }).focus();
    await userEvent.keyboard('{ArrowRight}');
    expect(onChoose).toHaveBeenLastCalledWith(2);
  });

  it('offers an opt-out as one compact choice, and marks omitted attributes as not applying', () => {
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
    expect(columnTitles()).toEqual(['Mains upgrade', 'Home tank']);
    expect(screen.getByRole('radio', { name: 'Home tank' })).toHaveAccessibleDescription(
      /River health rating: does not apply/,
    );
    expect(screen.getByRole('radio', { name: 'None of these' })).toBeInTheDocument();
    expect(screen.queryByText('—', { selector: 'td *' })).toBeInTheDocument();
  });
});
