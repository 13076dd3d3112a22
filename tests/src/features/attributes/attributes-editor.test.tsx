// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { Attribute, StudyDefinition } from '@shared/schemas/study-definition';
import { makeStudyDefinition, riverRating } from '../../../../scripts/lib/study-factory/definition';
import { getLevelLabel } from '@shared/study/level-labels';
import { ApiError } from '@/lib/api-client';
import { AttributesEditor } from '@/features/attributes/components/attributes-editor';

afterEach(cleanup);

const definition: StudyDefinition = makeStudyDefinition({
  only: ['river'],
  attributes: { river: riverRating(['Poor', 'Good']) },
  fixedAlternative: null,
});

function renderEditor(save = vi.fn()) {
  render(
    <AttributesEditor definition={definition} readOnly={false} save={save} uploadImage={vi.fn()} />,
  );
  return save;
}

describe('AttributesEditor', () => {
  it('shows unsaved changes, and an empty level label at its field without saving', async () => {
    const save = renderEditor();
    expect(screen.getByText('All changes saved')).toBeInTheDocument();
    const labels = screen.getAllByLabelText('Level label');
    await userEvent.clear(labels[1]);
    expect(screen.getByText('Unsaved changes')).toBeInTheDocument();
    await userEvent.click(screen.getByRole('button', { name: 'Save changes' }));
    expect(save).not.toHaveBeenCalled();
    expect(screen.getAllByLabelText('Level label')[1]).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByText('A level needs a label')).toBeInTheDocument();
  });

  it('saves a valid definition and shows it as saved', async () => {
    const save = vi.fn(async (d: StudyDefinition) => ({ definition: d, designDetached: false }));
    renderEditor(save);
    await userEvent.type(screen.getAllByLabelText('Level label')[1], 'ish');
    await userEvent.click(screen.getByRole('button', { name: 'Save changes' }));
    expect(save).toHaveBeenCalledTimes(1);
    expect(save.mock.calls[0][0].attributes[0].levels[1].label).toBe('Goodish');
    expect(await screen.findByText('All changes saved')).toBeInTheDocument();
  });

  it('shows a server field error at the field it names', async () => {
    const save = vi.fn(async () => {
      throw new ApiError(400, 'invalid_input', 'Invalid', [
        { path: 'definition.attributes.0.name', message: 'Name taken by the server' },
      ]);
    });
    renderEditor(save);
    await userEvent.type(screen.getByLabelText('Attribute name'), ' (2027)');
    await userEvent.click(screen.getByRole('button', { name: 'Save changes' }));
    expect(await screen.findByText('Name taken by the server')).toBeInTheDocument();
    expect(screen.getByLabelText('Attribute name')).toHaveAttribute('aria-invalid', 'true');
  });

  it('adds a numeric attribute whose labels stay derived from value and unit after saving', async () => {
    const save = vi.fn(async (d: StudyDefinition) => ({ definition: d, designDetached: false }));
    renderEditor(save);
    await userEvent.click(screen.getByRole('button', { name: 'Add numeric attribute' }));
    const card = screen.getAllByRole('region', { name: /^Attribute/ })[1];
    await userEvent.type(within(card).getByLabelText('Attribute name'), 'Monthly bill increase');
    await userEvent.type(within(card).getByLabelText('Unit'), '€');
    const values = within(card).getAllByLabelText('Value');
    await userEvent.clear(values[1]);
    await userEvent.type(values[1], '8');
    expect(within(card).getAllByLabelText('Shown as')[1]).toHaveAttribute(
      'placeholder',
      'Shown as €8',
    );
    await userEvent.clear(values[1]);
    await userEvent.type(values[1], '15');
    await userEvent.click(screen.getByRole('button', { name: 'Save changes' }));
    const saved: Attribute = save.mock.calls[0][0].attributes[1];
    // Stored empty: the label is derived, so a later change of value or unit shows through.
    expect(saved.levels.map((l) => l.label)).toEqual(['', '']);
    expect(saved.levels.map((l) => getLevelLabel(saved, l))).toEqual(['€0', '€15']);
    expect(saved.coding).toBe('linear');
  });

  it('flags an own label that no longer writes its value, until it is fixed or confirmed', async () => {
    // The scenario's bill with two levels whose own labels may or may not write their values.
    const [bill] = makeStudyDefinition({
      only: ['bill'],
      attributes: {
        bill: {
          levels: [
            { id: 'b0', label: 'No increase', value: 0 },
            { id: 'b6', label: '€6 a month', value: 6 },
          ],
        },
      },
    }).attributes;
    const save = vi.fn(async (d: StudyDefinition) => ({ definition: d, designDetached: false }));
    render(
      <AttributesEditor
        definition={{ ...definition, attributes: [bill] }}
        readOnly={false}
        save={save}
        uploadImage={vi.fn()}
      />,
    );
    // "No increase" does not write 0: flagged. "€6 a month" writes 6: not flagged.
    expect(screen.getAllByText(/Check this label/)).toHaveLength(1);
    const value = screen.getAllByLabelText('Value')[1];
    await userEvent.clear(value);
    await userEvent.type(value, '8');
    expect(screen.getAllByText(/Check this label/)).toHaveLength(2);
    expect(screen.getByText(/respondents see “€6 a month” while the model codes 8/)).toBeVisible();
    await userEvent.click(screen.getByLabelText('“No increase” is meant for the value 0'));
    expect(screen.getAllByText(/Check this label/)).toHaveLength(1);
    await userEvent.click(screen.getByRole('button', { name: 'Save changes' }));
    const levels = save.mock.calls[0][0].attributes[0].levels;
    expect(levels[0].labelConfirmed).toEqual({ value: 0, label: 'No increase' });
    expect(levels[1].labelConfirmed).toBeUndefined();
  });

  it('in read-only mode shows why and offers no editing', () => {
    render(
      <AttributesEditor
        definition={definition}
        readOnly
        readOnlyReason="Your role can read the attributes but not change them."
        save={vi.fn()}
        uploadImage={vi.fn()}
      />,
    );
    expect(screen.getByText(/can read the attributes/)).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Save changes' })).toBeNull();
    expect(screen.getByLabelText('Attribute name')).toBeDisabled();
    // No drag grips either: a faded grip still reads as "drag me".
    expect(screen.queryByRole('button', { name: /^Reorder / })).toBeNull();
  });
});
