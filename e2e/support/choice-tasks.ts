/**
 * The respondent's choice tasks as a person moves through them: the task's "Choice n of N"
 * heading, and a run of tasks answered alike.
 */
import { expect, type Page } from '@playwright/test';

/** The heading that names task `n` of `of`. */
export const choiceHeading = (page: Page, n: number, of: number) =>
  page.getByText(`Choice ${n} of ${of}`, { exact: true });

/** For each of `tasks` (of `of`): waits for its heading, picks `option` and goes on. */
export async function answerTasksAlike(page: Page, tasks: number[], of: number, option: string) {
  for (const n of tasks) {
    await expect(choiceHeading(page, n, of)).toBeVisible();
    await page.getByRole('radio', { name: option }).check();
    await page.getByRole('button', { name: 'Next' }).click();
  }
}
