/**
 * The demo study in a benchmark's scratch database, and a panel mixed logit of it started
 * through the API as the demo analyst (the spec `npm start` uses), to load the machine the way
 * an analyst does.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import type { CurrentUser } from '../../shared/schemas/auth';
import type { StudySummary } from '../../shared/schemas/study';
import type { Run, RunOptions } from '../../shared/schemas/run';
import { createJsonClient } from './json-client';
import { buildDemoRunInput, DEMO_STUDY_NAME } from './demo-run-input';

const root = path.resolve(import.meta.dirname, '../..');

/** Runs the demo seed (server/seed.ts) against `url`; returns the file with the demo sign-ins. */
export async function seedScratchDemo(url: string, workDir: string): Promise<string> {
  const credentials = path.join(workDir, 'demo-credentials.json');
  execFileSync(process.execPath, ['--import', 'tsx', 'server/seed.ts'], {
    cwd: root,
    env: {
      ...process.env,
      DATABASE_URL: url,
      DATA_DIR: workDir,
      CW_DEMO_CREDENTIALS_FILE: credentials,
    },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  return credentials;
}

export type DemoRun = { id: string; get(): Promise<Run>; cancel(): Promise<unknown> };

/** Signs in on `base` as the demo user with this role (from the seed's credentials file). */
export async function signInDemo(base: string, credentialsFile: string, role: string) {
  const request = createJsonClient(base);
  const list = JSON.parse(fs.readFileSync(credentialsFile, 'utf8')) as Array<{
    role: string;
    email: string;
    password: string;
  }>;
  const person = list.find((c) => c.role === role)!;
  const me = await request<CurrentUser>('POST', '/auth/sign-in', {
    email: person.email,
    password: person.password,
  });
  return { request, me, cookie: request.cookie };
}

export async function startDemoMixedRun(base: string, credentialsFile: string): Promise<DemoRun> {
  const { request, me } = await signInDemo(base, credentialsFile, 'analyst');
  for (const team of me.teams) {
    const studies = await request<StudySummary[]>('GET', `/teams/${team.id}/studies`);
    const study = studies.find((s) => s.name === DEMO_STUDY_NAME);
    if (!study) continue;
    const runs = `/teams/${team.id}/studies/${study.id}/runs`;
    const options = await request<RunOptions>('GET', `${runs}/options`);
    const run = await request<Run>('POST', runs, buildDemoRunInput(options, 'mixed'));
    return {
      id: run.id,
      get: () => request<Run>('GET', `${runs}/${run.id}`),
      cancel: () => request('POST', `${runs}/${run.id}/cancel`),
    };
  }
  throw new Error('the demo analyst sees no demo study');
}

export async function waitForRun(
  run: DemoRun,
  until: (r: Run) => boolean,
  timeoutMs = 600_000,
): Promise<Run> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const r = await run.get();
    if (until(r)) return r;
    if (r.status !== 'queued' && r.status !== 'running')
      throw new Error(`run ${r.id} ended (${r.status}: ${r.error ?? ''}) before the load`);
    if (Date.now() > deadline) throw new Error(`run ${r.id} still ${r.status}`);
    await new Promise((res) => setTimeout(res, 250));
  }
}
