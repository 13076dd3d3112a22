/**
 * Data collected elsewhere: the demo owner uploads a choice file with problems and reads them
 * by line and column, uploads the fixed file, edits the inferred attributes, creates the study
 * (shown as imported, no fieldwork), fits an MNL, then reads Tastes, Shares and Exports.
 */
import { parse } from 'csv-parse/sync';
import fs from 'node:fs';
import { expect, test } from '@playwright/test';
import { signIn } from './support/auth';
import { demoCredential } from './support/demo-credentials';
import { startRun } from './support/runs';
import { syntheticChoiceCsv } from '../scripts/lib/synthetic-choice-file';
import { openByLink } from './support/navigation';

const RESPONDENTS = 80;
const fixed = syntheticChoiceCsv(RESPONDENTS);
const lines = fixed.trim().split('\n');
// Line 2 and 3 are the first task's first two alternatives: choose both; a word as a bill on
// line 6; no river on line 9.
const broken = lines
  .map((line, i) => {
    const cells = line.split(',');
    if (i === 1 || i === 2) cells[3] = '1';
    if (i === 5) cells[4] = 'six';
    if (i === 8) cells[6] = '';
    return cells.join(',');
  })
  .join('\n');
const file = (name: string, text: string) => ({
  name,
  mimeType: 'text/csv',
  buffer: Buffer.from(text),
});

test('an owner imports choice data, fixes the file, edits attributes, fits an MNL and reads the results', async ({
  page,
}) => {
  test.setTimeout(300_000);
  const studyName = `Imported water survey ${Date.now()}`;
  await signIn(page, demoCredential('owner'));

  await test.step('a file with problems lists them by line and column; nothing is offered to save', async () => {
    await page.getByRole('button', { name: 'Import choice data' }).click();
    await expect(page.getByRole('heading', { name: 'Import choice data' })).toBeVisible();
    await page.getByLabel(/Choice file/).setInputFiles(file('survey.csv', broken));
    await page.getByRole('button', { name: 'Check the files' }).click();
    const problems = page.getByRole('table', { name: 'Problems in the files' });
    await expect(problems).toBeVisible();
    await expect(
      problems.getByRole('row').filter({ hasText: 'alternatives are chosen' }),
    ).toContainText('2');
    await expect(
      problems.getByRole('row').filter({ hasText: '“six” is not a number' }),
    ).toContainText('6');
    await expect(problems.getByRole('row').filter({ hasText: 'has no river' })).toContainText('9');
    await expect(page.getByRole('button', { name: 'Create the study' })).toBeDisabled();
  });

  await test.step('the fixed file passes; the inferred attributes are edited', async () => {
    await page.getByLabel(/Choice file/).setInputFiles(file('survey.csv', fixed));
    await page.getByRole('button', { name: 'Check the files' }).click();
    await expect(page.getByText('No problems found')).toBeVisible();
    await page.getByLabel('Study name').fill(studyName);
    const river = page.getByRole('group', { name: /Column river/ });
    await river.getByLabel('Attribute name').fill('River health');
    await river.getByLabel('Reference level').selectOption('poor');
    await river.getByLabel(/good/).fill('Good');
    const bill = page.getByRole('group', { name: /Column bill/ });
    await bill.getByLabel('Attribute name').fill('Monthly bill increase');
    await expect(bill.getByLabel(/This is the cost/)).toBeChecked();
    await page.getByRole('button', { name: 'Check again with this set-up' }).click();
    await expect(page.getByText('No problems found')).toBeVisible();
    await page.getByRole('button', { name: 'Create the study' }).click();
    await expect(page.getByRole('heading', { name: studyName })).toBeVisible();
    await expect(page.getByText('Imported', { exact: true }).first()).toBeVisible();
    await expect(page.getByRole('link', { name: /Fieldwork/ })).toHaveCount(0);
  });

  await test.step('fit an MNL, then a mixed logit for taste profiles', async () => {
    await expect(page.getByRole('heading', { name: 'Models' })).toBeVisible();
    const mnl = await startRun(page, { model: 'mnl', name: 'MNL of the imported file' });
    await expect(mnl.getByText('Done', { exact: true })).toBeVisible({ timeout: 90_000 });
    const mixed = await startRun(page, {
      model: 'mixed',
      name: 'Mixed logit of the imported file',
      draws: 50,
      profileDraws: 200,
    });
    await expect(mixed.getByText('Done', { exact: true })).toBeVisible({ timeout: 120_000 });
  });

  await test.step('Tastes, Shares and Exports read the imported data', async () => {
    await openByLink(page, /Tastes/, { name: 'Tastes' });
    await expect(page.getByText(`${RESPONDENTS} respondents`).first()).toBeVisible();
    await openByLink(page, /Shares/, { name: 'Shares', exact: true });
    await expect(page.getByText('Predicted shares', { exact: true })).toBeVisible();
    await openByLink(page, /Exports/, { name: 'Exports' });
    const longFile = page.getByRole('listitem').filter({ hasText: 'Choice data (long format)' });
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      longFile.getByRole('link', { name: 'CSV' }).first().click(),
    ]);
    const rows = parse(fs.readFileSync(await download.path())) as string[][];
    // One row per alternative of every imported task, plus the header.
    expect(rows).toHaveLength(lines.length);
  });
});
