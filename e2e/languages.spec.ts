/**
 * A study in two languages, end to end: the editor adds German on Questionnaire → Languages,
 * the translator's texts arrive without one, going live is refused with the missing text
 * named, the editor fills it in and goes live; a respondent whose link says ?lang=de answers
 * in German on a phone; Responses shows and filters the language.
 */
import { expect, request as playwrightRequest, test } from '@playwright/test';
import { e2eBaseUrl } from '../playwright.config';
import { signIn } from './support/auth';
import { demoEditor, larkspurDefinition, signInEditor } from './support/live-study';
import { demoQuestionnaire } from '../shared/schemas/questionnaire-defaults';

test('an editor adds German, fixes the missing text go-live names, and a respondent answers in German', async ({
  page,
  browser,
}) => {
  const api = await playwrightRequest.newContext({
    baseURL: e2eBaseUrl,
    extraHTTPHeaders: { Origin: e2eBaseUrl },
  });
  const teamId = await signInEditor(api);
  const created = await api.post(`/api/teams/${teamId}/studies`, {
    data: { name: `Languages e2e ${Date.now()}` },
  });
  const study = await created.json();
  const base = `/api/teams/${teamId}/studies/${study.id}`;
  expect(
    (await api.put(`${base}/definition`, { data: { definition: larkspurDefinition } })).ok(),
  ).toBe(true);
  await api.post(`${base}/design/jobs`, {
    data: { method: 'random', tasks: 8, blocks: 2, seed: 5 },
  });
  await expect
    .poll(async () => (await (await api.get(`${base}/design`)).json()).design !== null, {
      timeout: 60_000,
    })
    .toBe(true);
  const questionnaire = demoQuestionnaire(larkspurDefinition);
  expect((await api.put(`${base}/questionnaire`, { data: { questionnaire } })).ok()).toBe(true);

  await test.step('the editor adds German on Questionnaire → Languages', async () => {
    await signIn(page, demoEditor());
    await page.goto(`/teams/${teamId}/studies/${study.id}/questionnaire?tab=languages`);
    await page.getByLabel('Add a language').fill('de');
    await page.getByRole('button', { name: 'Add', exact: true }).click();
    await expect(page.getByRole('heading', { name: 'Texts in German (de)' })).toBeVisible();
  });

  await test.step('the translated texts arrive without one; going live is refused, naming it', async () => {
    const view = await (await api.get(`${base}/texts`)).json();
    const texts: Record<string, string> = Object.fromEntries(
      view.texts
        .filter((t: { key: string }) => t.key !== 'ui.next')
        .map((t: { key: string; source: string }) => [t.key, `DE ${t.source}`]),
    );
    texts['ui.start'] = 'Los geht’s';
    texts['ui.task_progress'] = 'Auswahl {n} von {total}';
    texts['ui.unlabeled_alternative'] = 'Angebot {letter}';
    expect((await api.put(`${base}/texts/de`, { data: { texts } })).ok()).toBe(true);
    await page.reload();
    await expect(
      page.getByText(/German \(de\) has no text for Survey app: Button: go to the next screen/),
    ).toBeVisible();
    await expect(page.getByRole('button', { name: 'Go live' })).toBeDisabled();
    await expect(page.getByText('1 missing')).toBeVisible();
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
