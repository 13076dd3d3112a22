/**
 * A study in two languages, end to end: the editor adds German on Questionnaire → Languages,
 * exports the XLIFF file for the translator, and imports it back translated but lacking one
 * text and carrying one the study does not have: the report names both; going live is refused
 * with the missing text named, the editor fills it in and goes live; a respondent whose link
 * says ?lang=de answers in German on a phone; Responses shows and filters the language.
 */
import { readFile } from 'node:fs/promises';
import { expect, test } from '@playwright/test';
import { signIn } from './support/auth';
import { demoEditor, larkspurDefinition, playwrightCall, signInEditor } from './support/live-study';
import { createStudyThroughApi } from '../scripts/lib/study-factory/api-study';
import { newApiContext } from './support/api-context';

test('an editor adds German, fixes the missing text go-live names, and a respondent answers in German', async ({
  page,
  browser,
}) => {
  const api = await newApiContext();
  const teamId = await signInEditor(api);
  // A draft with its design and the demo questionnaire, in English only so far.
  const study = await createStudyThroughApi(playwrightCall(api), teamId, {
    name: `Languages e2e ${Date.now()}`,
    definition: larkspurDefinition,
    designJob: { method: 'random', tasks: 8, blocks: 2, seed: 5 },
  });

  await test.step('the editor adds German on Questionnaire → Languages', async () => {
    await signIn(page, demoEditor());
    await page.goto(`/teams/${teamId}/studies/${study.id}/questionnaire?tab=languages`);
    await page.getByLabel('Add a language').fill('de');
    await page.getByRole('button', { name: 'Add', exact: true }).click();
    await expect(page.getByRole('heading', { name: 'Texts in German (de)' })).toBeVisible();
  });

  let xliff = '';
  await test.step('the editor exports the German XLIFF file', async () => {
    const downloading = page.waitForEvent('download');
    await page.getByRole('link', { name: 'Export XLIFF for German (de)' }).click();
    const download = await downloading;
    expect(download.suggestedFilename()).toMatch(/-texts-en-de\.xlf$/);
    xliff = await readFile(await download.path(), 'utf8');
    expect(xliff).toContain('srcLang="en" trgLang="de"');
  });

  await test.step('the translated file, lacking one text and with one unknown, is imported and reported', async () => {
    const translated = translateForJourney(xliff);
    await page.getByLabel('Import a file into German (de)').setInputFiles({
      name: 'texts-de.xlf',
      mimeType: 'application/xliff+xml',
      buffer: Buffer.from(translated, 'utf8'),
    });
    const report = page.getByRole('region', { name: 'Import report' });
    await expect(report.getByText(/^Imported \d+ texts into German \(de\)\.$/)).toBeVisible();
    const missing = report.getByRole('list', { name: 'Texts still missing in German (de)' });
    await expect(missing.getByText('ui.next', { exact: true })).toBeVisible();
    await expect(missing.getByRole('listitem')).toHaveCount(1);
    const extra = report.getByRole('list', { name: 'Texts of the file this study does not have' });
    await expect(extra.getByText(/^page\.retired\.title · line \d+$/)).toBeVisible();
    await expect(page.getByText('1 missing')).toBeVisible();
  });

  await test.step('going live is refused, naming the missing text', async () => {
    await expect(
      page.getByText(/German \(de\) has no text for Survey app: Button: go to the next screen/),
    ).toBeVisible();
    await expect(page.getByRole('button', { name: 'Go live' })).toBeDisabled();
  });

  await test.step('the editor writes the missing text and goes live', async () => {
    await page.getByLabel('German (de): Survey app: Button: go to the next screen').fill('Weiter');
    await page.getByRole('button', { name: 'Save German (de) texts' }).click();
    await expect(page.getByText('Saved.', { exact: true })).toBeVisible();
    await page.getByRole('button', { name: 'Go live' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Go live' }).click();
    await expect(page.getByText(/Live since version 1/)).toBeVisible();
  });

  await test.step('a respondent with ?lang=de answers in German on a phone', async () => {
    const phone = await browser.newContext({
      viewport: { width: 360, height: 740 },
      hasTouch: true,
    });
    const r = await phone.newPage();
    await r.goto(`/s/${study.publicId}?lang=de`);
    await expect(r.locator('html')).toHaveAttribute('lang', 'de');
    await expect(r.getByRole('group', { name: 'DE Language' })).toHaveCount(0);
    await r.getByRole('checkbox').check();
    await r.getByRole('button', { name: 'Los geht’s' }).click();
    const firstTask = r.getByText(/^Auswahl 1 von \d+$/);
    for (let i = 0; i < 5 && !(await firstTask.isVisible()); i++) {
      await r.getByRole('button', { name: 'DE Continue' }).click();
    }
    await expect(firstTask).toBeVisible();
    await r.getByRole('radio', { name: 'Angebot A' }).check();
    await r.getByRole('button', { name: 'Weiter' }).click();
    await expect(r.getByText(/^Auswahl 2 von \d+$/)).toBeVisible();
    await r.screenshot({
      path: test.info().outputPath('360px-task-in-german.png'),
      fullPage: true,
    });
    await phone.close();
  });

  await test.step('Responses shows the respondent’s language and filters by it', async () => {
    await page.goto(`/teams/${teamId}/studies/${study.id}/responses`);
    await page.getByLabel('Language').selectOption('de');
    const table = page.getByRole('table', { name: 'Respondents' });
    await expect(table.getByRole('columnheader', { name: 'Language' })).toBeVisible();
    await expect(table.getByRole('cell', { name: 'de', exact: true })).toHaveCount(1);
    await page.getByLabel('Language').selectOption('en');
    await expect(page.getByText('No respondent matches these filters.')).toBeVisible();
  });
});

/**
 * What the translator sends back: every unit's target is the source with "DE " before it, a
 * few in real German; the unit for the Next button is dropped, and a unit the study does not
 * have (a page removed since the export) is added.
 */
function translateForJourney(xml: string): string {
  const german: Record<string, string> = {
    'ui.start': 'Los geht’s',
    'ui.task_progress': 'Auswahl {n} von {total}',
    'ui.unlabeled_alternative': 'Angebot {letter}',
  };
  const translated = xml.replace(
    /<unit id="([^"]+)">([\s\S]*?)<\/unit>\n/g,
    (unit, key: string, body: string) => {
      if (key === 'ui.next') return '';
      const source = /<source>([\s\S]*?)<\/source>/.exec(body)?.[1] ?? '';
      return unit.replace('<target></target>', `<target>${german[key] ?? `DE ${source}`}</target>`);
    },
  );
  return translated.replace(
    '</file>',
    '<unit id="page.retired.title"><notes><note>Page “Retired”: title</note></notes>' +
      '<segment><source>Old</source><target>Alt</target></segment></unit>\n</file>',
  );
}
