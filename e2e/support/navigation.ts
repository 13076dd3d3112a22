/**
 * Moving around the app the way a user does: by the visible link, then waiting for the screen's
 * heading, so a step starts only once the section it acts on is on screen.
 */
import { expect, type Page } from '@playwright/test';

/** Clicks the first link whose name matches `link`; with `heading`, waits for that heading. */
export async function openByLink(
  page: Page,
  link: RegExp,
  heading?: { name: string; exact?: boolean },
): Promise<void> {
  await page.getByRole('link', { name: link }).first().click();
  if (heading) await expect(page.getByRole('heading', heading)).toBeVisible();
}
