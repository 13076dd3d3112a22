/**
 * Every respondent screen at phone widths (320, 360, 414 px) and on a desktop: nothing runs
 * off the side, a task shows its three alternatives side by side as a compact table, and an
 * axe scan finds no serious or critical violation. Screenshots of each screen are kept in the
 * test output. A task whose labels cannot fit a narrow phone falls back to stacked cards, and
 * the offline notice appears at the top of the screen.
 */
import { expect, test, type Page } from '@playwright/test';
import { createLiveStudy, larkspurDefinition } from './support/live-study';
import { expectNoSeriousAxeViolations } from './support/axe';
import { newApiContext } from './support/api-context';
import { answerTasksAlike } from './support/choice-tasks';

const WIDTHS = [320, 360, 414, 1280];

async function noSidewaysScroll(page: Page) {
  const overflow = await page.evaluate(
    () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
  );
  expect(overflow, 'the page scrolls sideways').toBeLessThanOrEqual(0);
}

async function check(page: Page, width: number, name: string) {
  await noSidewaysScroll(page);
  await expectNoSeriousAxeViolations(page, `${name} at ${width} px`);
  await page.screenshot({
    path: test.info().outputPath(`${width}px-${name}.png`),
    fullPage: true,
  });
}

// One test per width, each with its own study and respondent, so the widths run on separate
// workers at the same time.
for (const width of WIDTHS) {
  test(`at ${width} px every respondent screen fits and passes an axe scan`, async ({
    browser,
  }) => {
    const api = await newApiContext();
    const study = await createLiveStudy(api, `Screens e2e ${width} px ${Date.now()}`);
    const phone = width < 800;
    const context = await browser.newContext({
      viewport: { width, height: phone ? 740 : 900 },
      hasTouch: phone,
    });
    const page = await context.newPage();
    await page.goto(`/s/${study.publicId}?pid=W${width}`);
    await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
    await check(page, width, 'consent');
    await page.getByLabel('I have read this and agree to take part').check();
    await page.getByRole('button', { name: 'Start' }).click();
    await expect(page.getByRole('heading', { name: 'How the choices work' })).toBeVisible();
    await check(page, width, 'instructions');
    await page.getByRole('button', { name: 'Continue' }).click();

    await expect(page.getByText('Choice 1 of 4', { exact: true })).toBeVisible();
    const headers = page.locator('thead').getByRole('columnheader');
    await expect(headers).toHaveText(['Option A', 'Option B', 'Current service']);
    const boxes = await Promise.all([0, 1, 2].map((i) => headers.nth(i).boundingBox()));
    for (const box of boxes) {
      expect(box!.y).toBe(boxes[0]!.y);
      expect(box!.x + box!.width).toBeLessThanOrEqual(width);
    }
    await check(page, width, 'task');
    await page.getByRole('radio', { name: 'Option B' }).check();
    await expect(page.getByRole('radio', { name: 'Option B' })).toBeChecked();
    await check(page, width, 'task-chosen');
    await page.getByRole('button', { name: 'Next' }).click();
    await answerTasksAlike(page, [2, 3, 4], 4, 'Current service');

    const household = page.getByLabel('How many people live in your household, including you?');
    await expect(household).toBeVisible();
    await check(page, width, 'number-question');
    await household.fill('2');
    await page.getByRole('button', { name: 'Next' }).click();
    await expect(page.getByRole('radio', { name: '35–54' })).toBeVisible();
    await check(page, width, 'choice-question');
    await page.getByRole('radio', { name: '35–54' }).check();
    await page.getByRole('button', { name: 'Next' }).click();
    await page.getByRole('radio', { name: 'No' }).check();
    await page.getByRole('button', { name: 'Next' }).click();
    await expect(page.getByText(/Your answers have been saved/)).toBeVisible();
    await check(page, width, 'end');
    await context.close();
    await api.dispose();
  });
}

test('labels too long for a narrow phone fall back to stacked cards; the offline notice shows at the top', async ({
  browser,
}) => {
  const long = structuredClone(larkspurDefinition);
  const river = long.attributes.find((a) => a.id === 'river')!;
  river.levels = river.levels.map((l) => ({
    ...l,
    label: `${l.label}-rated-by-the-independent-catchment-inspectorate`,
  }));
  const api = await newApiContext();
  const study = await createLiveStudy(api, `Long labels e2e ${Date.now()}`, {
    definition: long,
  });
  const context = await browser.newContext({
    viewport: { width: 320, height: 700 },
    hasTouch: true,
  });
  const page = await context.newPage();
  await page.goto(`/s/${study.publicId}`);
  await page.getByLabel('I have read this and agree to take part').check();
  await page.getByRole('button', { name: 'Start' }).click();
  await page.getByRole('button', { name: 'Continue' }).click();
  await expect(page.getByText('Choice 1 of 4', { exact: true })).toBeVisible();
  await expect(page.getByRole('table')).toHaveCount(0);
  await expect(page.getByRole('radio', { name: 'Option A' })).toBeVisible();
  await noSidewaysScroll(page);
  await expectNoSeriousAxeViolations(page, 'stacked task at 320 px');
  await page.screenshot({ path: test.info().outputPath('320px-task-stacked.png'), fullPage: true });

  await page.route('**/api/r/*/answers', (route) => route.abort('internetdisconnected'));
  await page.getByRole('radio', { name: 'Option A' }).check();
  await page.getByRole('button', { name: 'Next' }).click();
  const notice = page.getByText(/You seem to be offline/);
  await expect(notice).toBeVisible();
  const box = await notice.boundingBox();
  expect(box!.y).toBeLessThan(60);
  await page.screenshot({ path: test.info().outputPath('320px-offline.png') });
  await page.unroute('**/api/r/*/answers');
  await context.close();
  await api.dispose();
});
