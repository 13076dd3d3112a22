/**
 * The Preview shows exactly what respondents see (no snapshots): a live respondent and the
 * preview of the same block and seed walk through a questionnaire with every page kind, and
 * at every screen the rendered main region (React's generated ids aside), the progress and
 * the study name are the same.
 */
import pg from 'pg';
import { expect, test, type Page } from '@playwright/test';
import { e2eDatabaseUrl } from './support/database';
import { createPage, demoQuestionnaire } from '../shared/schemas/questionnaire-defaults';
import { defaultQuestionnaireOptions, type Questionnaire } from '../shared/schemas/questionnaire';
import { createLiveStudy, demoEditor, larkspurDefinition } from './support/live-study';
import { signIn } from './support/auth';
import { newApiContext } from './support/api-context';

test.use({ viewport: { width: 360, height: 740 }, hasTouch: true });

/** The demo questionnaire plus every other page kind, and a title of our own on the tasks. */
function everyPageKind(): Questionnaire {
  const d = larkspurDefinition;
  const pages = demoQuestionnaire(d).pages.map((p) =>
    p.kind === 'tasks' ? { ...p, title: 'Which package would your household pick?' } : p,
  );
  const end = pages.pop()!;
  const tasksAt = pages.findIndex((p) => p.kind === 'tasks');
  pages.splice(1, 0, createPage('screening', d));
  pages.splice(tasksAt + 1, 0, createPage('warmup', d));
  pages.push(createPage('repeat', d), createPage('holdout', d), createPage('dominance', d), end);
  return { pages, options: defaultQuestionnaireOptions() };
}

/** The main region with React's per-tree ids replaced by their order of appearance. */
async function screenOf(page: Page) {
  const html = await page.locator('main').innerHTML();
  const ids = new Map<string, string>();
  return {
    html: html.replace(/_r_[0-9a-z]+_/g, (id) => {
      if (!ids.has(id)) ids.set(id, `id${ids.size}`);
      return ids.get(id)!;
    }),
    progress: await page.getByRole('progressbar').getAttribute('aria-valuenow'),
    header: await page.locator('header').innerText(),
  };
}

/** Answers the screen shown with the first choice everywhere (the screening question passes). */
async function answerScreen(page: Page) {
  const main = page.locator('main');
  const cards = main.locator('div[role="radio"]');
  if ((await cards.count()) > 0) await cards.first().click();
  else if ((await main.locator('input[type="radio"]').count()) > 0)
    await main.locator('input[type="radio"]').first().check();
  else if ((await main.locator('input[type="checkbox"]').count()) > 0)
    await main.locator('input[type="checkbox"]').first().check();
  else if ((await main.locator('input[type="text"]').count()) > 0)
    await main.locator('input[type="text"]').first().fill('2');
  await main.getByRole('button').last().click();
}

test('the preview of a block and seed equals a live respondent of that block and seed, screen by screen', async ({
  page,
  browser,
}) => {
  const api = await newApiContext();
  const study = await createLiveStudy(api, `Preview equality ${Date.now()}`, {
    questionnaire: everyPageKind(),
  });

  await page.goto(`/s/${study.publicId}`);
  await expect(page.locator('main h1')).toBeVisible();
  const db = new pg.Client({ connectionString: e2eDatabaseUrl() });
  await db.connect();
  const { rows } = await db.query(
    `select r.block, r.plan from respondents r join studies s on s.id = r.study_id
      where s.public_id = $1`,
    [study.publicId],
  );
  await db.end();
  expect(rows).toHaveLength(1);
  const { block, plan } = rows[0] as { block: number; plan: { seed: number } };

  const researcher = await browser.newContext({ viewport: { width: 360, height: 740 } });
  const preview = await researcher.newPage();
  await signIn(preview, demoEditor());
  await preview.goto(`/preview/${study.teamId}/${study.studyId}?block=${block}&seed=${plan.seed}`);
  await expect(preview.locator('main h1')).toBeVisible();

  const kinds: string[] = [];
  for (let step = 0; step < 40; step++) {
    const [live, shown] = [await screenOf(page), await screenOf(preview)];
    expect(shown, `screen ${step + 1}`).toEqual(live);
    kinds.push(await page.locator('main h1').innerText());
    if (live.progress === '100') break;
    await Promise.all(
      [page, preview].map(async (p) => {
        const before = await p.locator('main').innerText();
        await answerScreen(p);
        await expect
          .poll(() => p.locator('main').innerText(), { intervals: [50] })
          .not.toBe(before);
        await expect(p.locator('main h1')).toBeVisible();
      }),
    );
    // The live app says "saved" on its end page once the server has every answer.
    await expect(page.getByText('Saving your last answers…')).toHaveCount(0);
  }
  expect(kinds).toContain('Which package would your household pick?');
  expect(kinds).toContain('A first practice choice');
  expect(kinds.at(-1)).toBe('Thank you');
  await researcher.close();
});
