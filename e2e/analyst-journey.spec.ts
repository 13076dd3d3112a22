/**
 * The analyst's journey on the seeded demo study: start a panel mixed logit from the browser
 * (modest draws, so it finishes within a minute), watch its progress bar until it is done,
 * open Tastes and split a coefficient by a background question, then download the
 * per-respondent CSV and XLSX and check that both parse with one row per respondent and one
 * column per expected field.
 */
import fs from 'node:fs';
import { parse } from 'csv-parse/sync';
import ExcelJS from 'exceljs';
import { expect, test, type Download } from '@playwright/test';
import { signIn } from './support/auth';
import { demoCredential } from './support/demo-credentials';
import { startRun } from './support/runs';
import type { TasteList } from '../shared/schemas/tastes';
import { demoStudyLock, demoStudySeeded } from './support/demo-study';
import { openByLink } from './support/navigation';

async function readDownload(download: Download): Promise<Buffer> {
  const file = await download.path();
  return fs.readFileSync(file);
}

test(
  'an analyst runs a mixed logit, splits tastes by a background question and downloads the profiles',
  demoStudyLock,
  async ({ page }) => {
    await demoStudySeeded(180_000);
    const runName = `Mixed logit e2e ${Date.now()}`;
    await signIn(page, demoCredential('analyst'));

    await test.step('open the seeded demo study', async () => {
      await openByLink(page, /Water service packages/);
      // The live study's attributes are frozen: their fields look read-only, not like empty boxes.
      await openByLink(page, /Attributes/);
      const frozenField = page.getByRole('textbox').first();
      await expect(frozenField).toBeDisabled();
      await expect(frozenField).toHaveCSS('border-top-style', 'dashed');
      await openByLink(page, /Models/, { name: 'Models' });
    });

    await test.step('start a mixed logit with modest draws and watch it finish', async () => {
      const item = await startRun(page, {
        model: 'mixed',
        name: runName,
        draws: 50,
        profileDraws: 200,
      });
      await expect(item.getByRole('progressbar', { name: `Progress of ${runName}` })).toBeVisible();
      await expect(item.getByText('Done', { exact: true })).toBeVisible({ timeout: 90_000 });
      await expect(item.getByRole('progressbar')).toHaveCount(0);
    });

    const [, teamId, studyId] =
      new URL(page.url()).pathname.match(/^\/teams\/([^/]+)\/studies\/([^/]+)\//) ?? [];

    await test.step('open Tastes and split a coefficient by a background question', async () => {
      await openByLink(page, /Tastes/, { name: 'Tastes' });
      await expect(page.getByLabel('Run', { exact: true })).toContainText(runName);
      // One caution per screen, dismissible; the whole text behind Details.
      await expect(page.getByText(/Profiles are conditional on each respondent/)).toBeVisible();
      await page.getByLabel('Split by').selectOption('question');
      const question = page.getByLabel('Question');
      const firstQuestion = await question.locator('option').first().textContent();
      await question.selectOption({ index: 0 });
      await expect(page.getByRole('img', { name: /Histograms of .* by / })).toBeVisible();
      const groupRows = page.locator('table').filter({ hasText: 'Quartiles' }).locator('tbody tr');
      await expect(groupRows.first()).toBeVisible();
      expect(await groupRows.count()).toBeGreaterThanOrEqual(2);
      expect(firstQuestion?.length).toBeGreaterThan(0);
    });

    await test.step('shares follow every edit in the browser; welfare is marked out of date', async () => {
      await openByLink(page, /Shares/, { name: 'Shares', exact: true });
      await expect(page.getByText('Predicted shares', { exact: true })).toBeVisible();
      await expect(
        page.getByText(/95 % intervals from 200 draws of each respondent/),
      ).toBeVisible();
      await page.getByRole('button', { name: 'Compute welfare' }).click();
      // Welfare against the status quo, in the cost attribute's money, with its interval.
      await expect(page.getByText(/is worth .* per respondent on average/)).toContainText(
        '95 % interval',
      );
      // A segment adds one column per group beside Alternative, Share and the interval.
      await page.getByLabel('Shares by segment').selectOption({ index: 1 });
      await expect(page.locator('table thead th:nth-child(4)').first()).toBeVisible();
      await page.getByLabel('Name').first().fill('Package A renamed');
      await expect(page.getByText(/The scenario changed after this was computed/)).toBeVisible();
      await expect(page.getByRole('cell', { name: 'Package A renamed' })).toBeVisible();
    });

    // What the files should hold, from the same API the screens use.
    const runs = await page.request.get(`/api/teams/${teamId}/studies/${studyId}/tastes/runs`);
    const run = ((await runs.json()) as { id: string; name: string; profiles: number }[]).find(
      (r) => r.name === runName,
    )!;
    const headerRes = await page.request.get(
      `/api/teams/${teamId}/studies/${studyId}/tastes?runId=${run.id}&pageSize=1`,
    );
    const header = (await headerRes.json()) as TasteList;
    const expectedColumns =
      2 +
      (header.personalColumns ? 1 : 0) +
      5 +
      2 * header.coefficients.length +
      header.wtp.length +
      header.questions.length;
    expect(run.profiles).toBeGreaterThan(100);

    await test.step('download the per-respondent CSV and XLSX; both parse', async () => {
      await openByLink(page, /Exports/, { name: 'Exports' });
      await expect(page.getByLabel('Run', { exact: true })).toContainText(runName);
      const profiles = page.getByRole('listitem').filter({ hasText: 'Taste profiles' });

      const [csvDownload] = await Promise.all([
        page.waitForEvent('download'),
        profiles.getByRole('link', { name: 'CSV' }).click(),
      ]);
      const rows = parse(await readDownload(csvDownload)) as string[][];
      expect(rows).toHaveLength(run.profiles + 1);
      for (const row of rows) expect(row).toHaveLength(expectedColumns);
      expect(rows[0]).toContain('external_id');

      const [xlsxDownload] = await Promise.all([
        page.waitForEvent('download'),
        profiles.getByRole('link', { name: 'XLSX' }).click(),
      ]);
      const workbook = new ExcelJS.Workbook();
      await workbook.xlsx.load(
        (await readDownload(xlsxDownload)) as unknown as Parameters<typeof workbook.xlsx.load>[0],
      );
      const [about, sheet] = workbook.worksheets;
      expect(about.name).toBe('About');
      const facts: string[] = [];
      about.eachRow((r) => facts.push(String(r.getCell(1).value)));
      expect(facts).toEqual(
        expect.arrayContaining([
          'Study',
          'Model',
          'Data hash (SHA-256 of the long-format choice data)',
          'Exported',
          'Caution 1',
        ]),
      );
      expect(sheet.name).toBe('Profiles');
      expect(sheet.rowCount).toBe(run.profiles + 1);
      expect(sheet.getRow(1).cellCount).toBe(expectedColumns);
    });
  },
);
