// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { LanguagesCard } from '@/features/languages/components/languages-card';
import { TranslationTable } from '@/features/languages/components/translation-table';
import type { StudyTextsView } from '@shared/schemas/study-texts';
import { fakeFetch, renderWithQuery } from '../../support/render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const view: StudyTextsView = {
  languages: ['en', 'de'],
  editable: true,
  texts: [
    {
      key: 'study.title',
      where: 'Survey title (every screen)',
      source: 'Water and sewer',
      long: false,
    },
    { key: 'ui.next', where: 'Survey app: Button: next', source: 'Next', long: false },
  ],
  translations: { de: { 'study.title': 'Wasser', 'ui.next': 'Weiter' } },
  missing: { en: 0, de: 0 },
  stale: { de: { 'study.title': 'Water' } },
};
const props = { teamId: 't1', studyId: 's1', view, canEdit: true };

describe('stale translations on Questionnaire → Languages', () => {
  it('counts them per language in the list', () => {
    renderWithQuery(<LanguagesCard {...props} selected="de" onSelect={() => {}} />);
    expect(screen.getByText('1 source changed')).toBeVisible();
  });

  it('flags the translation with the wording it was made from, and leaves the others alone', () => {
    renderWithQuery(<TranslationTable {...props} lang="de" />);
    const rows = screen.getAllByRole('listitem');
    expect(within(rows[0]).getByText('Source changed')).toBeVisible();
    expect(within(rows[0]).getByText('Water')).toBeVisible();
    expect(within(rows[1]).queryByText('Source changed')).toBeNull();
    expect(screen.getByText(/1 translation was made from an earlier source wording/)).toBeVisible();
  });

  it('confirms one as still right through the API', async () => {
    const { requests } = fakeFetch({ status: 200, body: { ...view, stale: { de: {} } } });
    const user = userEvent.setup();
    renderWithQuery(<TranslationTable {...props} lang="de" />);
    await user.click(
      screen.getByRole('button', { name: 'Still right: Survey title (every screen)' }),
    );
    await vi.waitFor(() =>
      expect(requests).toEqual([
        {
          url: '/api/teams/t1/studies/s1/texts/de/confirmed',
          method: 'PUT',
          body: { keys: ['study.title'] },
        },
      ]),
    );
  });

  it('offers no confirmation to those who cannot edit', () => {
    renderWithQuery(<TranslationTable {...props} canEdit={false} lang="de" />);
    expect(screen.getByText('Source changed')).toBeVisible();
    expect(screen.queryByRole('button', { name: /Still right/ })).toBeNull();
  });
});
