/**
 * The owner erases one demo respondent on a data-protection request: finds them by number on
 * the Responses screen, reads what will go, gives a reason, confirms in the app's own dialog
 * and sees the result; the respondent's number is then refused as already erased. At 360 px
 * and on a desktop nothing runs off the side and axe finds no serious violation; screenshots
 * are kept in the test output.
 */
import { expect, test, type Page } from '@playwright/test';
import { signIn } from './support/auth';
import { demoCredential } from './support/demo-credentials';
import { expectNoSeriousAxeViolations } from './support/axe';
import { demoStudyLock, demoStudySeeded } from './support/demo-study';
import { openByLink } from './support/navigation';

async function check(page: Page, width: number, name: string) {
  const overflow = await page.evaluate(
    () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
  );
  expect(overflow, 'the page scrolls sideways').toBeLessThanOrEqual(0);
  await expectNoSeriousAxeViolations(page, `${name} at ${width} px`);
  // The respondent list above makes the full page very long: keep the viewport, scrolled to the panel.
  await page.screenshot({ path: test.info().outputPath(`${width}px-${name}.png`) });
}

async function openErasure(page: Page, number: string) {
  await page.getByText('Erase one respondent (data-protection request)').click();
  await page.getByLabel('Respondent number').fill(number);
  await page.getByRole('button', { name: 'Find', exact: true }).click();
  await expect(page.getByRole('region', { name: 'What will be erased' })).toBeVisible();
}

test(
  'an owner erases one respondent on request, confirming in the dialog',
  demoStudyLock,
  async ({ page }) => {
    await demoStudySeeded(120_000);
    await signIn(page, demoCredential('owner'));
    await openByLink(page, /Water service packages/);
    await openByLink(page, /Responses/, { name: 'Responses' });

    await test.step('at 360 px: find respondent 2 and read what will go', async () => {
      await page.setViewportSize({ width: 360, height: 800 });
      await openErasure(page, '2');
      await page.getByLabel('Reason (kept in the audit trail)').fill('Request DP-2026-014');
      await page.getByRole('region', { name: 'What will be erased' }).scrollIntoViewIfNeeded();
      await check(page, 360, 'erasure-preview');
      await page.getByRole('button', { name: 'Erase respondent 2…' }).click();
      const dialog = page.getByRole('dialog', { name: 'Erase respondent 2?' });
      await expect(dialog).toBeVisible();
      await check(page, 360, 'erasure-dialog');
      await dialog.getByRole('button', { name: 'Cancel' }).click();
      await expect(dialog).toHaveCount(0);
    });

    await test.step('on a desktop: confirm, and the number is then refused', async () => {
      await page.setViewportSize({ width: 1280, height: 900 });
      await page.getByRole('button', { name: 'Erase respondent 2…' }).click();
      const dialog = page.getByRole('dialog', { name: 'Erase respondent 2?' });
      await check(page, 1280, 'erasure-dialog');
      await dialog.getByRole('button', { name: 'Erase for good' }).click();
      await expect(page.getByText('Erased respondent 2.')).toBeVisible();
      await check(page, 1280, 'erasure-done');
      await page.getByLabel('Respondent number').fill('2');
      await page.getByRole('button', { name: 'Find', exact: true }).click();
      await expect(page.getByText('Already erased')).toBeVisible();
    });
  },
);
