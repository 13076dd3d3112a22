/**
 * The decision maker's what-if journey on the demo study: a multinomial logit of the demo data
 * (started through the API as the Models form would, so the journey does not wait for a mixed
 * logit), then on Shares: edit the scenario and watch the shares follow in the browser, save it,
 * sweep the monthly bill to draw a demand curve, save a second scenario, compare the two side by
 * side, and download the scenario as CSV (recomputed by the server: same numbers as on screen).
 */
import fs from 'node:fs';
import { parse } from 'csv-parse/sync';
import { expect, test } from '@playwright/test';
import { signIn } from './support/auth';
import { demoCredential } from './support/demo-credentials';
import { buildDemoRunInput } from '../scripts/lib/demo-run-input';
import type { Run, RunOptions } from '../shared/schemas/run';
import { demoStudyLock, demoStudySeeded } from './support/demo-study';
import { openByLink } from './support/navigation';

test(
  'an analyst edits, saves, sweeps, compares and downloads what-if shares',
  demoStudyLock,
  async ({ page }) => {
    await demoStudySeeded(180_000);
    const runName = `Shares e2e MNL ${Date.now()}`;
    await signIn(page, demoCredential('analyst'));
    await openByLink(page, /Water service packages/);
    await page.waitForURL(/\/teams\/[^/]+\/studies\/[^/]+\//);
    const [, teamId, studyId] =
      new URL(page.url()).pathname.match(/^\/teams\/([^/]+)\/studies\/([^/]+)/) ?? [];
    const runsPath = `/api/teams/${teamId}/studies/${studyId}/runs`;

    await test.step('a multinomial logit of the demo data finishes', async () => {
      const optionsRes = await page.request.get(`${runsPath}/options`);
      expect(optionsRes.status()).toBe(200);
      const options = (await optionsRes.json()) as RunOptions;
      const res = await page.request.post(runsPath, {
        data: { ...buildDemoRunInput(options, 'mnl'), name: runName },
        headers: { Origin: new URL(page.url()).origin },
      });
      expect(res.status()).toBe(201);
      const run = (await res.json()) as Run;
      await expect
        .poll(
          async () =>
            ((await (await page.request.get(`${runsPath}/${run.id}`)).json()) as Run).status,
          {
            timeout: 90_000,
          },
        )
        .toBe('done');
      await page.goto(`/teams/${teamId}/studies/${studyId}/shares?run=${run.id}`);
    });

    const shares = page.locator('table').filter({ hasText: '95 % interval' }).first();

    await test.step('open Shares; an edit changes the shares at once, with their interval', async () => {
      await expect(page.getByRole('heading', { name: 'Shares', exact: true })).toBeVisible();
      await expect(page.getByText(/Krinsky–Robb draws of the estimates/)).toBeVisible();
      const before = await shares.locator('tbody tr').first().locator('td').nth(1).textContent();
      await page.getByLabel('Monthly bill increase').first().selectOption({ label: '€15' });
      await expect(shares.locator('tbody tr').first().locator('td').nth(1)).not.toHaveText(before!);
      await page.getByLabel('Name').first().fill('Clean river, dear');
      await expect(shares.getByRole('cell', { name: 'Clean river, dear' })).toBeVisible();
    });

    await test.step('save it under a name', async () => {
      await page.getByLabel('Scenario name').fill(`Dear ${runName}`);
      await page.getByRole('button', { name: 'Save as new scenario' }).click();
      await expect(page.getByText(`Saved scenarios — editing “Dear ${runName}”`)).toBeVisible();
    });

    await test.step('sweep the monthly bill into a demand curve', async () => {
      await page.getByLabel('Attribute to sweep').selectOption({ label: 'Monthly bill increase' });
      await page.getByRole('button', { name: 'Draw the demand curve' }).click();
      await expect(
        page.getByRole('img', {
          name: /Demand curve of Clean river, dear by Monthly bill increase/,
        }),
      ).toBeVisible();
      await page.getByText('The curve as a table').click();
      const curveRows = page
        .locator('table')
        .filter({ hasText: 'Share of Clean river, dear' })
        .locator('tbody tr');
      await expect(curveRows).toHaveCount(11);
    });

    await test.step('save a second scenario and compare the two side by side', async () => {
      await page.getByLabel('Monthly bill increase').first().selectOption({ label: '€3' });
      await page.getByLabel('Name').first().fill('Clean river, cheap');
      await page.getByLabel('Scenario name').fill(`Cheap ${runName}`);
      await page.getByRole('button', { name: 'Save as new scenario' }).click();
      await expect(page.getByText(`Saved scenarios — editing “Cheap ${runName}”`)).toBeVisible();
      await page.getByLabel(`Compare Dear ${runName}`).check();
      await page.getByLabel(`Compare Cheap ${runName}`).check();
      const comparison = page.getByRole('table', { name: 'Saved scenarios compared' });
      await expect(comparison.getByRole('columnheader', { name: `Dear ${runName}` })).toBeVisible();
      await expect(
        comparison.getByRole('columnheader', { name: `Cheap ${runName}` }),
      ).toBeVisible();
      await expect(comparison.getByText('Clean river, dear')).toBeVisible();
      await expect(comparison.getByText('Clean river, cheap')).toBeVisible();
    });

    await test.step('download the scenario as CSV: the shares on screen', async () => {
      const onScreen = await shares
        .locator('tbody tr')
        .evaluateAll((rows) =>
          rows.map((r) => [r.children[0].textContent, r.children[1].textContent]),
        );
      const [download] = await Promise.all([
        page.waitForEvent('download'),
        page.getByRole('button', { name: 'Download the shares as CSV' }).click(),
      ]);
      expect(download.suggestedFilename()).toMatch(/-shares-\d{4}-\d{2}-\d{2}\.csv$/);
      const rows = parse(fs.readFileSync(await download.path()), { columns: true }) as Record<
        string,
        string
      >[];
      expect(rows.map((r) => r.alternative)).toEqual(onScreen.map(([name]) => name));
      // The screen rounds to 0.1 percentage point.
      rows.forEach((r, j) =>
        expect(Math.abs(Number(r.share) * 100 - parseFloat(onScreen[j][1]!))).toBeLessThanOrEqual(
          0.05 + 1e-9,
        ),
      );
      expect(rows.reduce((s, r) => s + Number(r.share), 0)).toBeCloseTo(1, 10);
    });
  },
);
