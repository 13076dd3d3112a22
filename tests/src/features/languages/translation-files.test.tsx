// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { ImportRefusal, ImportReport } from '@/features/languages/components/import-report';
import { TranslationFilesCard } from '@/features/languages/components/translation-files-card';
import { ApiError } from '@/lib/api-client';
import { fakeFetch, fieldRefusal, renderWithQuery } from '../../support/render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('ImportReport', () => {
  it('counts the texts taken and lists the missing and the unknown ones by where they are met', () => {
    render(
      <ImportReport
        lang="de"
        report={{
          imported: 41,
          missing: [
            { key: 'ui.next', where: 'Survey app: Button: go to the next screen', interface: true },
          ],
          extra: [{ key: 'page.gone.title', where: 'Page “Old intro”: title', line: 88 }],
        }}
      />,
    );
    expect(screen.getByText('Imported 41 texts into German (de).')).toBeVisible();
    const missing = screen.getByRole('list', { name: 'Texts still missing in German (de)' });
    expect(within(missing).getByText('Survey app: Button: go to the next screen')).toBeVisible();
    expect(within(missing).getByText('ui.next')).toBeVisible();
    expect(screen.getByText('Still missing in German (de): 1 text')).toBeVisible();
    const extra = screen.getByRole('list', { name: 'Texts of the file this study does not have' });
    expect(within(extra).getByText('Page “Old intro”: title')).toBeVisible();
    expect(within(extra).getByText('page.gone.title · line 88')).toBeVisible();
  });

  it('says when nothing was taken and when every text is there', () => {
    render(<ImportReport lang="ar" report={{ imported: 0, missing: [], extra: [] }} />);
    expect(screen.getByText(/No text was imported/)).toBeVisible();
    expect(
      screen.getByText('Every text of the study now has a wording in Arabic (ar).'),
    ).toBeVisible();
    expect(screen.queryByRole('list')).toBeNull();
  });
});

describe('ImportRefusal', () => {
  it('shows the reason, that nothing changed, and each problem with its line', () => {
    const error = new ApiError(
      400,
      'invalid_input',
      'Nothing was imported: 2 texts of the file cannot be taken',
      [
        {
          path: 'texts.study.title',
          message: 'Line 4: study.title is given again (first on line 2)',
        },
        {
          path: 'texts.ui.start',
          message: 'Line 5: the text of ui.start has 6,001 characters; at most 6,000',
        },
      ],
    );
    render(<ImportRefusal error={error} />);
    const alert = screen.getByRole('alert');
    expect(alert).toHaveTextContent('Nothing was imported: 2 texts of the file cannot be taken');
    expect(alert).toHaveTextContent('Nothing was changed.');
    const problems = within(alert).getByRole('list', { name: 'Problems in the file' });
    expect(
      within(problems)
        .getAllByRole('listitem')
        .map((li) => li.textContent),
    ).toEqual([
      'Line 4: study.title is given again (first on line 2)',
      'Line 5: the text of ui.start has 6,001 characters; at most 6,000',
    ]);
  });
});

describe('TranslationFilesCard', () => {
  const props = { teamId: 't1', studyId: 's1', lang: 'de', canImport: true };

  it('links both exports to the API and hides the import from those who cannot edit', () => {
    renderWithQuery(<TranslationFilesCard {...props} canImport={false} />);
    expect(screen.getByRole('link', { name: 'Export XLIFF for German (de)' })).toHaveAttribute(
      'href',
      '/api/teams/t1/studies/s1/texts/de/file?format=xliff',
    );
    expect(screen.getByRole('link', { name: 'Export CSV for German (de)' })).toHaveAttribute(
      'href',
      '/api/teams/t1/studies/s1/texts/de/file?format=csv',
    );
    expect(screen.queryByLabelText('Import a file into German (de)')).toBeNull();
  });

  it('sends the file as text with the format its name says, and shows the report', async () => {
    const { requests } = fakeFetch({
      status: 200,
      body: { imported: 3, missing: [], extra: [] },
    });
    const user = userEvent.setup();
    renderWithQuery(<TranslationFilesCard {...props} />);
    const csv = 'key,where,en,de\nstudy.title,Title,Water,Wasser\n';
    await user.upload(
      screen.getByLabelText('Import a file into German (de)'),
      new File([csv], 'water-texts-en-de.csv', { type: 'text/csv' }),
    );
    expect(await screen.findByText('Imported 3 texts into German (de).')).toBeVisible();
    expect(requests).toEqual([
      {
        url: '/api/teams/t1/studies/s1/texts/de/file',
        method: 'POST',
        body: { format: 'csv', content: csv },
      },
    ]);
  });

  it('reads a file a spreadsheet saved in Windows-1252 with its accented letters', async () => {
    const { requests } = fakeFetch({ status: 200, body: { imported: 1, missing: [], extra: [] } });
    const user = userEvent.setup();
    renderWithQuery(<TranslationFilesCard {...props} />);
    const csv = 'key,where,en,de\nstudy.title,Title,Water,Gewässer für Sie\n';
    // Windows-1252 writes ä as 0xE4 and ü as 0xFC, one byte each (latin1 agrees on them).
    const bytes = Buffer.from(csv, 'latin1');
    await user.upload(
      screen.getByLabelText('Import a file into German (de)'),
      new File([new Uint8Array(bytes)], 'water-texts-en-de.csv', { type: 'text/csv' }),
    );
    expect(await screen.findByText('Imported 1 text into German (de).')).toBeVisible();
    expect(requests[0].body).toEqual({ format: 'csv', content: csv });
  });

  it('refuses a file that is neither XLIFF nor CSV without sending it', async () => {
    const { fn } = fakeFetch();
    const user = userEvent.setup({ applyAccept: false });
    renderWithQuery(<TranslationFilesCard {...props} />);
    await user.upload(
      screen.getByLabelText('Import a file into German (de)'),
      new File(['PK'], 'texts.docx'),
    );
    expect(await screen.findByRole('alert')).toHaveTextContent(
      '“texts.docx” is not an XLIFF (.xlf) or CSV (.csv) file.',
    );
    expect(fn).not.toHaveBeenCalled();
  });

  it('shows the server’s refusal with its line', async () => {
    fakeFetch(
      fieldRefusal(400, 'invalid_input', 'The XLIFF file cannot be read', [
        { path: 'file', message: 'Line 7: Not well-formed XML: unclosed tag' },
      ]),
    );
    const user = userEvent.setup();
    renderWithQuery(<TranslationFilesCard {...props} />);
    await user.upload(
      screen.getByLabelText('Import a file into German (de)'),
      new File(['<xliff>'], 'texts.xlf'),
    );
    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('The XLIFF file cannot be read');
    expect(alert).toHaveTextContent('Line 7: Not well-formed XML: unclosed tag');
  });
});
