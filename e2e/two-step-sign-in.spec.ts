/**
 * A researcher turns on two-step sign-in from the account page (scans the key, confirms with a
 * code, saves the recovery codes), signs out, and signs in again with a code from the app, then
 * once with a recovery code. The codes are computed from the key shown on the page with the
 * otpauth package, as an authenticator app would (RFC 6238).
 */
import { expect, test } from '@playwright/test';
import * as OTPAuth from 'otpauth';
import { E2E_PASSWORD, signOut, signUp } from './support/auth';
import { uniqueAddress } from './support/mail';
import { expectNoSeriousAxeViolations } from './support/axe';

const codeAt = (key: string, steps: number) =>
  OTPAuth.TOTP.generate({
    secret: OTPAuth.Secret.fromBase32(key.replace(/\s/g, '')),
    algorithm: 'SHA1',
    digits: 6,
    period: 30,
    timestamp: Date.now() + steps * 30_000,
  });

async function passwordStep(page: import('@playwright/test').Page, email: string) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(E2E_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'Two-step sign-in' })).toBeVisible();
}

test('two-step sign-in: set up with an app, sign in with a code, then with a recovery code', async ({
  page,
}) => {
  const me = { name: 'Tomasz Wielgus', email: uniqueAddress('twostep'), password: E2E_PASSWORD };
  let key = '';
  let recoveryCodes: string[] = [];

  await test.step('set up from the account page and save the recovery codes', async () => {
    await signUp(page, { ...me, teamName: 'Larkspur Valley Water security' });
    await page.goto('/account');
    await page.getByRole('button', { name: 'Set up two-step sign-in' }).click();
    const setup = page.getByRole('form', { name: 'Set up two-step sign-in' });
    await expect(
      setup.getByRole('img', { name: 'QR code for your authenticator app' }),
    ).toBeVisible();
    key = (await setup.locator('code').innerText()).trim();
    await expectNoSeriousAxeViolations(page, 'account: two-step set-up');
    await setup
      .getByLabel('Code from the app')
      .fill('000000' === codeAt(key, 0) ? '111111' : '000000');
    await setup.getByRole('button', { name: 'Turn on two-step sign-in' }).click();
    await expect(setup.getByText('Wrong or already used code')).toBeVisible();
    await setup.getByLabel('Code from the app').fill(codeAt(key, 0));
    await setup.getByRole('button', { name: 'Turn on two-step sign-in' }).click();
    const list = page.getByRole('list', { name: 'Recovery codes' });
    await expect(list.getByRole('listitem')).toHaveCount(10);
    recoveryCodes = await list.getByRole('listitem').allInnerTexts();
    await page.getByRole('button', { name: 'I have saved them' }).click();
    await expect(page.getByText('10 of 10 recovery codes left')).toBeVisible();
  });

  await test.step('sign in again: the password, then a code from the app', async () => {
    await signOut(page);
    await passwordStep(page, me.email);
    await page.getByLabel('Code from the app').fill(codeAt(key, 1));
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect(page.getByRole('navigation', { name: 'Main' })).toBeVisible();
  });

  await test.step('a lost phone: a recovery code signs in once', async () => {
    await signOut(page);
    await passwordStep(page, me.email);
    await page.getByRole('button', { name: 'Use a recovery code instead' }).click();
    await page.getByLabel('Recovery code').fill(recoveryCodes[0]!);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect(page.getByRole('navigation', { name: 'Main' })).toBeVisible();
    await page.goto('/account');
    await expect(page.getByText('9 of 10 recovery codes left')).toBeVisible();
  });
});
