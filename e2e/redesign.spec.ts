/**
 * Pilot → priors → redesign on the seeded demo study: a finished MNL run's estimates become the
 * priors of a new design, the new and the current design are compared under those priors, the
 * new one is adopted on the live study as version 2, and a respondent who started before keeps
 * their tasks while a new respondent gets the new design's tasks.
 */
import { expect, test, type APIRequestContext } from '@playwright/test';
import { signIn } from './support/auth';
import { demoCredential } from './support/demo-credentials';
import { demoStudyLock, demoStudySeeded } from './support/demo-study';
import { newApiContext } from './support/api-context';

type Screen = { key: string; kind: string };

async function signInApi(api: APIRequestContext) {
  expect((await api.post('/api/auth/sign-in', { data: demoCredential('owner') })).status()).toBe(
    200,
  );
  const me = await (await api.get('/api/auth/me')).json();
  const teamId = me.teams[0].id as string;
  const studies = await (await api.get(`/api/teams/${teamId}/studies`)).json();
  const list = (Array.isArray(studies) ? studies : studies.studies) as {
    id: string;
    name: string;
    publicId: string;
  }[];
  const demo = list.find((s) => s.name.startsWith('Water service packages'))!;
  return { teamId, study: demo, base: `/api/teams/${teamId}/studies/${demo.id}` };
}

// Designed tasks only (keys task:N), not the repeated or dominance-test screens.
const taskCount = (screens: Screen[]) => screens.filter((s) => s.key.startsWith('task:')).length;

test(
  'a finished run becomes priors, the new design is compared, adopted live, and new respondents get it',
  demoStudyLock,
  async ({ page }) => {
    await demoStudySeeded(240_000);
    const request = await newApiContext();
    const { teamId, study, base } = await signInApi(request);
    const runName = `Pilot MNL ${Date.now()}`;
    let before: { sessionToken: string; screens: Screen[] };

    await test.step('the study is live with a finished MNL run (set up through the API)', async () => {
      const status = (await (await request.get(`${base}/lifecycle`)).json()).status;
      if (status === 'closed')
        expect((await request.post(`${base}/lifecycle/reopen`)).status()).toBe(200);
      const options = await (await request.get(`${base}/runs/options`)).json();
      const created = await request.post(`${base}/runs`, {
        data: {
          name: runName,
          spec: {
            model: 'mnl',
            coefficients: options.columns.map((c: { code: string; key: string }) => ({
              name: c.code,
              column: c.key,
            })),
          },
        },
      });
      expect(created.status(), await created.text()).toBe(201);
      const run = await created.json();
      await expect
        .poll(async () => (await (await request.get(`${base}/runs/${run.id}`)).json()).status, {
          timeout: 120_000,
        })
        .toBe('done');
      const started = await request.post(`/api/r/${study.publicId}/sessions`, { data: {} });
      expect(started.status()).toBe(201);
      before = await started.json();
      expect(taskCount(before.screens)).toBe(8);
    });

    await signIn(page, demoCredential('owner'));

    await test.step('use the run as priors for a new design', async () => {
      await page.goto(`/teams/${teamId}/studies/${study.id}/models`);
      await page.getByRole('link', { name: runName }).first().click();
      await page.getByRole('link', { name: 'Use as priors for a new design' }).click();
      await expect(page.getByRole('heading', { name: 'Priors from a run' })).toBeVisible();
      await expect(page.getByLabel('Run', { exact: true })).toHaveValue(/.+/);
      const priors = page.getByRole('table', { name: 'Priors from the run' });
      await expect(priors).toContainText('Monthly bill increase');
      await page.getByRole('button', { name: 'Use these priors in the design settings' }).click();
      const form = page.getByRole('form', { name: 'Design settings' });
      await expect(form.getByLabel('Priors', { exact: true })).toHaveValue('bayesian');
      await form.getByLabel('Tasks', { exact: true }).fill('12');
      await form.getByLabel('Blocks').fill('2');
      await form.getByLabel('Random starts').fill('2');
      await form.getByLabel('Prior draws').fill('50');
      await form.getByRole('button', { name: 'Generate and compare' }).click();
    });

    await test.step('compare the current and the new design under the new priors', async () => {
      const comparison = page.getByRole('table', { name: 'Design comparison' });
      await expect(comparison).toBeVisible({ timeout: 120_000 });
      for (const name of ['D-error', 'A-error', 'S-estimate', 'C-error'])
        await expect(
          comparison.getByRole('rowheader', { name: new RegExp(`^${name}`) }),
        ).toBeVisible();
      await expect(page.getByText(/Adopting makes the new design version 2/)).toBeVisible();
    });

    await test.step('adopt it: the live study gets version 2', async () => {
      await page.getByRole('button', { name: 'Adopt the new design' }).click();
      await expect(page.getByRole('table', { name: 'Design comparison' })).toBeHidden();
      const lifecycle = await (await request.get(`${base}/lifecycle`)).json();
      expect(lifecycle).toMatchObject({ status: 'live', currentVersion: 2 });
    });

    await test.step('the earlier respondent keeps 8 tasks; a new one gets the new 6', async () => {
      const resumed = await request.get(`/api/r/${study.publicId}/session`, {
        headers: { 'x-respondent-token': before.sessionToken },
      });
      expect(resumed.status()).toBe(200);
      expect(taskCount((await resumed.json()).screens)).toBe(8);
      const fresh = await request.post(`/api/r/${study.publicId}/sessions`, { data: {} });
      expect(fresh.status()).toBe(201);
      expect(taskCount((await fresh.json()).screens)).toBe(6);
    });
  },
);
