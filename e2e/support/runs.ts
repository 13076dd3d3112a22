/** Starting an estimation run from the Models screen, as a researcher does. */
import type { Locator, Page } from '@playwright/test';

export async function startRun(
  page: Page,
  opts: { model: 'mnl' | 'mixed'; name: string; draws?: number; profileDraws?: number },
): Promise<Locator> {
  await page.getByRole('button', { name: 'New run' }).click();
  await page.getByLabel('Model', { exact: true }).selectOption(opts.model);
  await page.getByLabel('Name', { exact: true }).fill(opts.name);
  if (opts.draws) await page.getByLabel('Draws per respondent').fill(String(opts.draws));
  if (opts.profileDraws)
    await page.getByLabel('Draws for taste profiles').fill(String(opts.profileDraws));
  await page.getByRole('button', { name: 'Start run' }).click();
  return page.getByRole('listitem').filter({ hasText: opts.name });
}
