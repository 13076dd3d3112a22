/** Signing up, in and out through the real screens. */
import { expect, type Page } from '@playwright/test';
import { firstLink, waitForMail } from './mail';

export const E2E_PASSWORD = 'taste and odour warnings';

export type Person = { name: string; email: string; password: string };

export async function fillSignUp(page: Page, p: Person & { teamName?: string }): Promise<void> {
  await page.getByLabel('Your name').fill(p.name);
  await page.getByLabel('E-mail').fill(p.email);
  await page.getByLabel('Password', { exact: true }).fill(p.password);
  if (p.teamName !== undefined) await page.getByLabel('Team name').fill(p.teamName);
  await page.getByRole('button', { name: 'Create account' }).click();
}

/** After the form: the inbox notice, then the link from the confirmation mail signs in. */
export async function confirmFromMail(page: Page, email: string): Promise<void> {
  await expect(page.getByRole('heading', { name: 'Check your inbox' })).toBeVisible();
  const mail = await waitForMail(email, 15_000, /^Confirm your e-mail address/);
  await page.goto(firstLink(mail.text));
  await page.getByRole('button', { name: 'Confirm and sign in' }).click();
}

export async function signUp(page: Page, p: Person & { teamName: string }): Promise<void> {
  await page.goto('/sign-up');
  await fillSignUp(page, p);
  await confirmFromMail(page, p.email);
  await expect(page.getByRole('heading', { name: 'Studies' })).toBeVisible();
}

export async function signIn(page: Page, p: Pick<Person, 'email' | 'password'>): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(p.email);
  await page.getByLabel('Password', { exact: true }).fill(p.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('navigation', { name: 'Main' })).toBeVisible();
}

export async function signOut(page: Page): Promise<void> {
  await page.getByRole('button', { name: 'Sign out', exact: true }).click();
  await expect(page.getByRole('heading', { name: 'Sign in to Choicewright' })).toBeVisible();
}

/** The team id from a /teams/:teamId/... address. */
export function teamIdFromUrl(url: string): string {
  const m = new URL(url).pathname.match(/^\/teams\/([0-9a-f-]{36})\//);
  if (!m) throw new Error(`not a team page: ${url}`);
  return m[1];
}
