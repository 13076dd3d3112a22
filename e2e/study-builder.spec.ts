/**
 * An editor builds a study from scratch: creates it, adds two attributes with their levels,
 * saves, generates a random design in the background, reads its diagnostics, and previews a
 * task in the respondent app at phone and desktop width.
 */
import { expect, test } from '@playwright/test';
import { signIn } from './support/auth';
import { demoCredential } from './support/demo-credentials';

test('an editor creates a study, adds attributes, generates a design and previews a task', async ({
  page,
}) => {
  const name = `Pipe renewal packages ${Date.now()}`;
  await signIn(page, demoCredential('editor'));

  await test.step('create the study', async () => {
    await page.getByRole('button', { name: 'New study' }).click();
    await page.getByLabel('Study name').fill(name);
    await page.getByRole('button', { name: 'Create study' }).click();
    await expect(page.getByRole('heading', { name })).toBeVisible();
    await expect(page.getByRole('link', { name: /Attributes/ })).toHaveAttribute(
      'aria-current',
      'page',
    );
  });

  await test.step('add a categorical and a numeric attribute, then save', async () => {
    const cards = page.locator('section[aria-label^="Attribute"]');
    await page.getByRole('button', { name: 'Add categorical attribute' }).click();
    const river = cards.nth(0);
    await river.getByLabel('Attribute name').fill('River health rating');
    await river.getByLabel('Level label').nth(0).fill('Poor');
    await river.getByLabel('Level label').nth(1).fill('Good');
    // Reorder with the keyboard: lift the handle, move up one place, drop. The drag library
    // announces each step in a live region; wait for it as a screen-reader user would.
    const announced = (text: RegExp) => page.locator('[id^="DndLiveRegion"]', { hasText: text });
    await river.getByRole('button', { name: 'Reorder level Good' }).focus();
    await page.keyboard.press('Space');
    await expect(announced(/level Good is over position 2 of 2\./)).toHaveCount(1);
    await page.keyboard.press('ArrowUp');
    await expect(announced(/level Good is over position 1 of 2\./)).toHaveCount(1);
    await page.keyboard.press('Space');
    await expect(river.getByLabel('Level label').nth(0)).toHaveValue('Good');
    await expect(river.getByLabel('Level label').nth(1)).toHaveValue('Poor');

    await page.getByRole('button', { name: 'Add numeric attribute' }).click();
    const bill = cards.nth(1);
    await bill.getByLabel('Attribute name').fill('Monthly bill increase');
    await bill.getByLabel('Unit').fill('€');
    await bill.getByLabel('Value').nth(0).fill('0');
    await bill.getByLabel('Value').nth(1).fill('5');
    await bill.getByLabel('This is the cost attribute').check();

    await expect(page.getByText('Unsaved changes')).toBeVisible();
    await page.getByRole('button', { name: 'Save changes' }).click();
    await expect(page.getByText('All changes saved')).toBeVisible();
  });

  await test.step('generate a random design and read the diagnostics', async () => {
    await page.getByRole('link', { name: /Tasks/ }).click();
    await page.getByLabel('Method').selectOption('random');
    await page.getByLabel('Tasks', { exact: true }).fill('4');
    await page.getByLabel('Blocks').fill('1');
    await page.getByRole('button', { name: 'Generate design' }).click();
    await expect(page.getByText('Choice tasks — Random, level-balanced')).toBeVisible({
      timeout: 60_000,
    });
    const diagnostics = page.getByRole('complementary', { name: 'Diagnostics' });
    await expect(diagnostics.getByText('Design quality')).toBeVisible();
    await expect(diagnostics.getByText('Level balance and overlap')).toBeVisible();
    await expect(diagnostics.getByText('Sample-size guide')).toBeVisible();
    await expect(page.getByRole('table').first()).toContainText('€5');
  });

  await test.step('preview a task and choose an option', async () => {
    await page.getByRole('link', { name: /Preview/ }).click();
    // The respondent app itself, in a frame of phone width, starting at the chosen screen. With a
    // cost attribute the default questionnaire adds the cheap-talk and budget-reminder pages first.
    await page
      .getByLabel('Screen', { exact: true })
      .selectOption({ label: '5. Choice task (choice 1 of 4)' });
    const phone = page.frameLocator('iframe[title^="Respondent screen preview"]');
    await expect(phone.getByRole('radio', { name: 'Option A' })).toBeVisible();
    await phone.getByRole('radio', { name: 'Option B' }).click();
    await expect(phone.getByRole('radio', { name: 'Option B' })).toBeChecked();
    await phone.getByRole('button', { name: 'Next' }).click();
    await expect(page.getByLabel('Screen', { exact: true })).toHaveValue('5');
    await page
      .locator('label')
      .filter({ hasText: /^Desktop/ })
      .click();
    await expect(
      page
        .frameLocator('iframe[title="Respondent screen preview, desktop width"]')
        .getByText('River health rating')
        .first(),
    ).toBeVisible();
  });
});
