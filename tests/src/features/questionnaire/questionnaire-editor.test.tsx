// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import type { Active, Over } from '@dnd-kit/core';
import { demoDefinition } from '@server/seed/demo-definition';
import { QuestionnaireEditor } from '@/features/questionnaire/components/questionnaire-editor';
import { pageAnnouncements } from '@/features/questionnaire/components/page-list';
import { defaultQuestionnaire } from '@shared/schemas/questionnaire-defaults';
import type { Questionnaire } from '@shared/schemas/questionnaire';
import type { StudyDefinition } from '@shared/schemas/study-definition';
import { makeStudyDefinition, riverRating } from '../../../../scripts/lib/study-factory/definition';

const definition: StudyDefinition = makeStudyDefinition({
  only: ['river'],
  attributes: { river: riverRating(['Poor', 'Good']) },
  fixedAlternative: null,
});

let saved: Questionnaire[];
beforeEach(() => {
  saved = [];
  vi.stubGlobal('fetch', async (_url: string, init?: RequestInit) => {
    const body = JSON.parse(String(init?.body));
    saved.push(body.questionnaire);
    return new Response(
      JSON.stringify({ questionnaire: body.questionnaire, saved: true, editable: true }),
      {
        status: 200,
        headers: { 'content-type': 'application/json' },
      },
    );
  });
});
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function renderEditor(editable = true) {
  const qc = new QueryClient();
  render(
    <QueryClientProvider client={qc}>
      <QuestionnaireEditor
        teamId="t1"
        studyId="s1"
        initial={defaultQuestionnaire(definition)}
        saved={false}
        editable={editable}
        definition={definition}
      />
    </QueryClientProvider>,
  );
}

/** The rows of the page list, in order. */
const pageItems = () =>
  within(screen.getByRole('list', { name: 'Questionnaire pages' })).getAllByRole('listitem');

describe('QuestionnaireEditor', () => {
  it('adds a dominance test before the end page with the best levels prefilled, and saves', async () => {
    const user = userEvent.setup();
    renderEditor();
    await user.selectOptions(screen.getByLabelText('Add a page'), 'dominance');
    await user.click(screen.getByRole('button', { name: 'Add' }));
    const pages = pageItems();
    expect(pages.map((p) => p.textContent)).toEqual([
      expect.stringContaining('Welcome and consent'),
      expect.stringContaining('Instructions'),
      expect.stringContaining('Choice tasks'),
      expect.stringContaining('Dominance test'),
      expect.stringContaining('End page'),
    ]);
    expect(screen.getByLabelText('Best level of River health rating')).toHaveValue('good');
    await user.click(screen.getByRole('button', { name: 'Save questionnaire' }));
    await waitFor(() => expect(saved).toHaveLength(1));
    expect(saved[0].pages.map((p) => p.kind)).toEqual([
      'consent',
      'instructions',
      'tasks',
      'dominance',
      'end',
    ]);
  });

  it('lists what to fix and keeps Save disabled while a question key is invalid', async () => {
    const user = userEvent.setup();
    renderEditor();
    await user.click(screen.getByRole('button', { name: 'Add' }));
    const key = screen.getByLabelText('Key (column name in exports)');
    await user.clear(key);
    await user.type(key, 'Bad Key');
    expect(screen.getByRole('button', { name: 'Save questionnaire' })).toBeDisabled();
    expect(screen.getByText('1 thing to fix before saving')).toBeInTheDocument();
    expect(
      screen.getByText('Start with a letter; use lowercase letters, digits and _'),
    ).toBeInTheDocument();
  });

  it('offers no remove button for the consent page and no editing when frozen', async () => {
    renderEditor(false);
    expect(screen.queryByRole('button', { name: 'Remove page' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /^Move page/ })).not.toBeInTheDocument();
    expect(screen.getByLabelText('Title')).toBeDisabled();
    expect(screen.getByText('The questionnaire is frozen')).toBeInTheDocument();
  });
});

/** The demo study's definition: five attributes, one of them the monthly bill (the cost). */
const withCost = demoDefinition;

function renderWith(def: StudyDefinition, initial = defaultQuestionnaire(def)) {
  render(
    <QueryClientProvider client={new QueryClient()}>
      <QuestionnaireEditor
        teamId="t1"
        studyId="s1"
        initial={initial}
        saved={false}
        editable
        definition={def}
      />
    </QueryClientProvider>,
  );
}

describe('QuestionnaireEditor follow-up templates', () => {
  it('offers a cheap-talk text and a budget reminder before the tasks when there is a cost', () => {
    renderWith(withCost);
    const pages = pageItems();
    expect(pages.map((p) => p.textContent)).toEqual([
      expect.stringContaining('Welcome and consent'),
      expect.stringContaining('Instructions'),
      expect.stringContaining('Cheap-talk text'),
      expect.stringContaining('Budget reminder'),
      expect.stringContaining('Choice tasks'),
      expect.stringContaining('End page'),
    ]);
  });

  it('adds an attribute-attendance question naming its published source, after the tasks', async () => {
    const user = userEvent.setup();
    renderWith(definition);
    expect(within(screen.getByLabelText('Add a page')).queryByText('Budget reminder')).toBeNull();
    await user.selectOptions(screen.getByLabelText('Add a page'), 'template:attendance');
    await user.click(screen.getByRole('button', { name: 'Add' }));
    expect(screen.getByRole('heading', { name: 'Attribute-attendance question' })).toBeVisible();
    expect(screen.getByText(/Hensher, Rose & Greene \(2005\)/)).toBeVisible();
    expect(screen.getByLabelText('Key (column name in exports)')).toHaveValue('features_ignored');
    const pages = pageItems();
    expect(pages.at(-2)?.textContent).toContain('Attribute-attendance question');
  });

  it('lets a generated key follow the question text, and keeps a key the researcher typed', async () => {
    const user = userEvent.setup();
    renderWith(definition);
    await user.selectOptions(screen.getByLabelText('Add a page'), 'question');
    await user.click(screen.getByRole('button', { name: 'Add' }));
    const key = screen.getByLabelText('Key (column name in exports)');
    expect(key).toHaveValue('new_question');
    const text = screen.getByLabelText('Question');
    await user.clear(text);
    await user.type(text, 'Do you own a garden?');
    expect(key).toHaveValue('do_you_own_a_garden');
    await user.clear(key);
    await user.type(key, 'garden');
    await user.type(text, ' Or a yard?');
    expect(key).toHaveValue('garden');
  });

  it('announces page names and numbers, not ids, when a page is moved', () => {
    const q = defaultQuestionnaire(withCost);
    const movable = q.pages.filter((p) => p.kind !== 'consent' && p.kind !== 'end');
    const say = pageAnnouncements(q.pages, movable);
    const [, , cheapTalk, budget] = q.pages;
    const active = { id: cheapTalk.id } as Active;
    expect(say.onDragStart({ active })).toBe(
      'Picked up page “Please choose as if it were real” at position 3 of 6.',
    );
    expect(say.onDragOver({ active, over: { id: budget.id } as Over })).toBe(
      'page “Please choose as if it were real” is over position 4 of 6.',
    );
    for (const p of q.pages) expect(say.onDragStart({ active })).not.toContain(p.id);
  });
});
