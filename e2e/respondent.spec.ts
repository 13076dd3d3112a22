/**
 * A respondent on a phone (360 × 740) answers a live study from its public link: consent,
 * every choice task, the background questions, the end page. A reload in the middle resumes
 * at the same task; one answer sent while the network is cut arrives exactly once later.
 */
import pg from 'pg';
import { expect, test, type Page } from '@playwright/test';
import { e2eDatabaseUrl } from './support/database';
import { createLiveStudy } from './support/live-study';
import { newApiContext } from './support/api-context';
import { choiceHeading } from './support/choice-tasks';

test.use({ viewport: { width: 360, height: 740 }, hasTouch: true });

async function chooseAndGoOn(page: Page, option: string) {
  await page.getByRole('radio', { name: option }).click();
  await expect(page.getByRole('radio', { name: option })).toBeChecked();
  await page.getByRole('button', { name: 'Next' }).click();
}

test('a respondent answers every screen on a phone, survives a reload and a dropped connection', async ({
  page,
}) => {
  const api = await newApiContext();
  const study = await createLiveStudy(api, `Water services e2e ${Date.now()}`);
  const pid = `E2E-${Date.now()}`;
  const attempts: string[] = [];
  page.on('request', (r) => {
    if (r.url().includes('/answers') && r.method() === 'POST')
      attempts.push(r.postDataJSON().screenKey);
  });

  await test.step('consent and instructions', async () => {
    await page.goto(`/s/${study.publicId}?pid=${pid}`);
    await expect(
      page.getByRole('heading', { name: 'Your water services for the next five years' }),
    ).toBeFocused();
    await expect(page.getByText(/stop at any time/)).toBeVisible();
    await expect(page.getByRole('button', { name: 'Start' })).toBeDisabled();
    await page.getByLabel('I have read this and agree to take part').check();
    await page.getByRole('button', { name: 'Start' }).click();
    await expect(page.getByRole('heading', { name: 'How the choices work' })).toBeVisible();
    await page.getByRole('button', { name: 'Continue' }).click();
  });

  await test.step('two tasks, then a reload resumes at the third', async () => {
    await expect(choiceHeading(page, 1, 4)).toBeVisible();
    await chooseAndGoOn(page, 'Option A');
    await expect(choiceHeading(page, 2, 4)).toBeVisible();
    await chooseAndGoOn(page, 'Current service');
    await expect(choiceHeading(page, 3, 4)).toBeVisible();
    await page.reload();
    await expect(choiceHeading(page, 3, 4)).toBeVisible();
    await expect(page.getByRole('radio', { name: 'Option B' })).not.toBeChecked();
  });

  await test.step('the third answer is sent while the network is cut, and arrives once', async () => {
    let cut = true;
    await page.route('**/api/r/*/answers', async (route) => {
      if (cut) {
        cut = false;
        await route.abort('internetdisconnected');
      } else await route.continue();
    });
    await chooseAndGoOn(page, 'Option B');
    // The respondent is not held up: the next task shows while the answer waits for its retry.
    await expect(choiceHeading(page, 4, 4)).toBeVisible();
    await expect
      .poll(() => attempts.filter((k) => k === attempts[attempts.length - 1]).length, {
        timeout: 15_000,
      })
      .toBeGreaterThanOrEqual(2);
    await page.unroute('**/api/r/*/answers');
    await chooseAndGoOn(page, 'Option A');
  });

  await test.step('background questions and the end page', async () => {
    await expect(
      page.getByRole('heading', { name: 'How many people live in your household, including you?' }),
    ).toBeVisible();
    await page.getByRole('button', { name: 'Next' }).click();
    await expect(page.getByRole('alert')).toHaveText('Enter a number.');
    await page.getByLabel('How many people live in your household, including you?').fill('3');
    await page.getByRole('button', { name: 'Next' }).click();
    await page.getByRole('radio', { name: '35–54' }).check();
    await page.getByRole('button', { name: 'Next' }).click();
    await page.getByRole('radio', { name: 'Yes' }).check();
    await page.getByRole('button', { name: 'Next' }).click();
    await expect(page.getByRole('heading', { name: 'Thank you' })).toBeVisible();
    await expect(page.getByText(/Your answers have been saved/)).toBeVisible();
    await expect(
      page.getByRole('progressbar', { name: 'Progress through the survey' }),
    ).toHaveAttribute('aria-valuenow', '100');
  });

  await test.step('the database holds exactly one row per answered screen', async () => {
    const client = new pg.Client({ connectionString: e2eDatabaseUrl() });
    await client.connect();
    try {
      const { rows: people } = await client.query(
        `select r.id, r.status, r.block from respondents r join studies s on s.id = r.study_id
         where s.public_id = $1 and r.external_id = $2`,
        [study.publicId, pid],
      );
      expect(people).toHaveLength(1);
      expect(people[0].status).toBe('completed');
      const { rows } = await client.query(
        `select screen_key, count(*)::int as n, min(task_number) as task from answers
         where respondent_id = $1 group by screen_key`,
        [people[0].id],
      );
      expect(rows.every((r) => r.n === 1)).toBe(true);
      expect(rows.filter((r) => r.task !== null)).toHaveLength(4);
      expect(rows).toHaveLength(2 + 4 + 3);
    } finally {
      await client.end();
    }
    const retried = attempts.filter((k, i) => attempts.indexOf(k) !== i);
    expect(retried.length).toBeGreaterThanOrEqual(1);
  });
  await api.dispose();
});
