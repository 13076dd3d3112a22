/**
 * A new owner invites a teammate as analyst; the teammate reads the mail, creates an account
 * from the link, joins, and sees the team with an analyst's permissions.
 */
import { expect, test } from '@playwright/test';
import {
  confirmFromMail,
  E2E_PASSWORD,
  fillSignUp,
  signIn,
  signOut,
  signUp,
  teamIdFromUrl,
} from './support/auth';
import { firstLink, uniqueAddress, waitForMail } from './support/mail';

test('an owner invites an analyst, who joins from the e-mailed link with read-only team rights', async ({
  page,
}) => {
  const owner = { name: 'Maren Okafor', email: uniqueAddress('owner'), password: E2E_PASSWORD };
  const analyst = { name: 'Priya Raman', email: uniqueAddress('analyst'), password: E2E_PASSWORD };
  const teamName = 'Larkspur Valley Water panel';

  await test.step('the owner signs up and invites a teammate as analyst', async () => {
    await signUp(page, { ...owner, teamName });
    await page.getByRole('link', { name: 'Team', exact: true }).click();
    await expect(page.getByRole('heading', { name: 'Team members' })).toBeVisible();
    await expect(page.getByRole('form', { name: 'Rename the team' })).toBeVisible();
    const invite = page.getByRole('form', { name: 'Invite a teammate' });
    await invite.getByLabel('E-mail address').fill(analyst.email);
    await invite.getByLabel('Role').selectOption('analyst');
    await invite.getByRole('button', { name: 'Send invitation' }).click();
    await expect(invite.getByText(`Invitation sent to ${analyst.email}`)).toBeVisible();
    await expect(
      page.getByRole('list', { name: 'Pending invitations' }).getByText(analyst.email),
    ).toBeVisible();
  });
  const teamId = teamIdFromUrl(page.url());

  await test.step('the owner cannot leave the team without an owner', async () => {
    await page.getByLabel(`Role of ${owner.name}`).selectOption('viewer');
    await page.getByRole('button', { name: `Save role of ${owner.name}` }).click();
    await expect(page.getByRole('alert')).toContainText('A team needs at least one owner');
    await expect(page.getByLabel(`Role of ${owner.name}`)).toHaveValue('owner');
    await signOut(page);
  });

  const mail = await waitForMail(analyst.email);
  expect(mail.subject).toBe(`${owner.name} invited you to ${teamName} on Choicewright`);
  const link = firstLink(mail.text);

  await test.step('the teammate opens the link and creates an account with the invited address', async () => {
    await page.goto(link);
    await expect(page.getByText(teamName)).toBeVisible();
    await expect(page.getByText('Analyst', { exact: true })).toBeVisible();
    await expect(page.getByText(owner.name)).toBeVisible();
    await page.getByRole('link', { name: 'Create an account' }).click();
    await expect(page.getByLabel('E-mail')).toHaveValue(analyst.email);
    await fillSignUp(page, analyst);
    await confirmFromMail(page, analyst.email);
  });

  await test.step('back on the invitation, the teammate accepts and lands in the team', async () => {
    await page.getByRole('button', { name: 'Accept and join the team' }).click();
    await expect(page).toHaveURL(new RegExp(`/teams/${teamId}/members$`));
    await signOut(page);
  });

  await test.step('signed in again, the analyst sees members read-only', async () => {
    await signIn(page, analyst);
    await page.goto(`/teams/${teamId}/members`);
    const members = page.getByRole('list', { name: 'Team members' });
    await expect(members.getByText(owner.name)).toBeVisible();
    await expect(members.getByText(analyst.name)).toBeVisible();
    await expect(members.getByText('Analyst', { exact: true })).toBeVisible();
    await expect(page.getByText('your role: Analyst')).toBeVisible();
    await expect(page.getByText('Only owners can invite people')).toBeVisible();
    await expect(page.getByRole('form', { name: 'Invite a teammate' })).toHaveCount(0);
    await expect(page.getByRole('form', { name: 'Rename the team' })).toHaveCount(0);
    await expect(page.getByRole('combobox')).toHaveCount(1); // only the team switcher
    await expect(page.getByRole('button', { name: /^Remove / })).toHaveCount(0);
    await expect(page.getByRole('heading', { name: 'Pending invitations' })).toHaveCount(0);
  });

  await test.step('the used link cannot be used again', async () => {
    await page.goto(link);
    await expect(page.getByText('This invitation cannot be used')).toBeVisible();
  });
});
