/**
 * Back on a phone (360 px) and a desktop: a respondent goes back to a choice task and to a
 * question, sees what they chose, changes it and carries on. The server keeps the latest
 * answer as the current one and the earlier one in the history: every screen is answered once
 * and nothing is lost. Screenshots of the screens seen again are kept in the test output.
 */
import pg from 'pg';
import { expect, test, type Page } from '@playwright/test';
import { e2eDatabaseUrl } from './support/database';
import { createLiveStudy } from './support/live-study';
import { expectNoSeriousAxeViolations } from './support/axe';
import { newApiContext } from './support/api-context';
import { answerTasksAlike } from './support/choice-tasks';

async function stored(publicId: string, pid: string) {
  const db = new pg.Client({ connectionString: e2eDatabaseUrl() });
  await db.connect();
  try {
    const { rows: current } = await db.query(
      `select a.screen_key, a.chosen_position, a.value, a.revision_count from answers a
         join respondents r on r.id = a.respondent_id join studies s on s.id = r.study_id
        where s.public_id = $1 and r.external_id = $2`,
      [publicId, pid],
    );
    const { rows: history } = await db.query(
      `select h.screen_key, h.chosen_position, h.value from answer_revisions h
         join respondents r on r.id = h.respondent_id join studies s on s.id = r.study_id
        where s.public_id = $1 and r.external_id = $2 order by h.replaced_at`,
      [publicId, pid],
    );
    return { current, history };
  } finally {
    await db.end();
  }
}

async function shot(page: Page, width: number, name: string) {
  await expectNoSeriousAxeViolations(page, `${name} at ${width} px`);
  await page.screenshot({ path: test.info().outputPath(`${width}px-${name}.png`), fullPage: true });
}

for (const width of [360, 1280]) {
  test(`at ${width} px a respondent goes back, changes a choice and an answer, and each screen counts once`, async ({
    browser,
  }) => {
    const api = await newApiContext();
    const study = await createLiveStudy(api, `Back e2e ${width} ${Date.now()}`);
    const phone = width < 800;
    const context = await browser.newContext({
      viewport: { width, height: phone ? 740 : 900 },
      hasTouch: phone,
    });
    const page = await context.newPage();
    const pid = `B${width}x${Date.now()}`;
    await page.goto(`/s/${study.publicId}?pid=${pid}`);
    await page.getByLabel('I have read this and agree to take part').check();
    await page.getByRole('button', { name: 'Start' }).click();
    // The consent cannot be changed: no Back on the screen after it.
    await expect(page.getByRole('heading', { name: 'How the choices work' })).toBeVisible();
    await expect(page.getByRole('button', { name: 'Back' })).toHaveCount(0);
    await page.getByRole('button', { name: 'Continue' }).click();

    await expect(page.getByText('Choice 1 of 4', { exact: true })).toBeVisible();
    await page.getByRole('radio', { name: 'Option B' }).check();
    await page.getByRole('button', { name: 'Next' }).click();
    await expect(page.getByText('Choice 2 of 4', { exact: true })).toBeVisible();
    await shot(page, width, 'task-with-back');

    await page.getByRole('button', { name: 'Back' }).click();
    await expect(page.getByText('Choice 1 of 4', { exact: true })).toBeVisible();
    await expect(page.getByRole('radio', { name: 'Option B' })).toBeChecked();
    await shot(page, width, 'task-seen-again');
    await page.getByRole('radio', { name: 'Current service' }).check();
    await page.getByRole('button', { name: 'Next' }).click();
    // On to the first screen not yet answered.
    await answerTasksAlike(page, [2, 3, 4], 4, 'Option A');

    const household = page.getByLabel('How many people live in your household, including you?');
    await household.fill('2');
    await page.getByRole('button', { name: 'Next' }).click();
    await expect(page.getByRole('radio', { name: '35–54' })).toBeVisible();
    await page.getByRole('button', { name: 'Back' }).click();
    await expect(household).toHaveValue('2');
    await shot(page, width, 'question-seen-again');
    await household.fill('3');
    await page.getByRole('button', { name: 'Next' }).click();
    await page.getByRole('radio', { name: '35–54' }).check();
    await page.getByRole('button', { name: 'Next' }).click();
    await page.getByRole('radio', { name: 'No' }).check();
    await page.getByRole('button', { name: 'Next' }).click();
    await expect(page.getByText(/Your answers have been saved/)).toBeVisible();

    await expect
      .poll(async () => (await stored(study.publicId, pid)).history.length, { timeout: 15_000 })
      .toBe(2);
    const { current, history } = await stored(study.publicId, pid);
    const keys = current.map((a) => a.screen_key as string);
    expect(new Set(keys).size).toBe(keys.length);
    const task1 = current.find((a) => a.screen_key === history[0].screen_key)!;
    expect(task1.revision_count).toBe(1);
    expect(task1.chosen_position).toBe(2);
    expect(history[0].chosen_position).toBe(1);
    const question = current.find((a) => a.screen_key === history[1].screen_key)!;
    expect(question.value).toEqual({ kind: 'number', number: 3 });
    expect(history[1].value).toEqual({ kind: 'number', number: 2 });
    await context.close();
    await api.dispose();
  });
}
