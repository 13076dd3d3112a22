/**
 * Starts two estimation runs on the demo study so that Models, Tastes, Shares and Exports have
 * content right after `npm start`: an MNL, then a panel mixed logit (normal attribute tastes,
 * negative lognormal cost). It goes through the HTTP API as the demo analyst, with the specs the
 * Models form builds (its own builder, src/features/runs/utils/run-form-values.ts), and does
 * nothing when the study already has runs. It does not wait: the worker estimates in the
 * background and the Models section shows progress. Called by scripts/start.sh once the server
 * answers; it never fails the start (problems are printed as warnings, exit code 0).
 *   APP_URL                   server to talk to (default http://127.0.0.1:5180)
 *   CW_DEMO_CREDENTIALS_FILE  demo sign-ins written by the seed (default .data/demo-credentials.json)
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { CurrentUser } from '../shared/schemas/auth';
import { createJsonClient } from './lib/json-client';
import type { StudySummary } from '../shared/schemas/study';
import type { Run, RunOptions } from '../shared/schemas/run';
import { buildDemoRunInput, DEMO_STUDY_NAME } from './lib/demo-run-input';

const root = path.resolve(import.meta.dirname, '..');
const baseUrl = process.env.APP_URL ?? 'http://127.0.0.1:5180';
const credentialsFile =
  process.env.CW_DEMO_CREDENTIALS_FILE ?? path.join(root, '.data', 'demo-credentials.json');

type Credential = { role: string; email: string; password: string };

function readAnalyst(): Credential {
  const list = JSON.parse(readFileSync(credentialsFile, 'utf8')) as Credential[];
  const analyst = list.find((c) => c.role === 'analyst');
  if (!analyst) throw new Error(`no analyst sign-in in ${credentialsFile}`);
  return analyst;
}

async function startDemoRuns(): Promise<void> {
  const request = createJsonClient(baseUrl);
  const analyst = readAnalyst();
  const me = await request<CurrentUser>('POST', '/auth/sign-in', {
    email: analyst.email,
    password: analyst.password,
  });
  for (const team of me.teams) {
    const studiesPath = `/teams/${team.id}/studies`;
    const study = (await request<StudySummary[]>('GET', studiesPath)).find(
      (s) => s.name === DEMO_STUDY_NAME,
    );
    if (!study) continue;
    const runsPath = `${studiesPath}/${study.id}/runs`;
    const existing = await request<Run[]>('GET', runsPath);
    if (existing.length > 0) {
      console.log(
        `  Demo runs: the demo study already has ${existing.length} run(s); none started.`,
      );
      return;
    }
    const options = await request<RunOptions>('GET', `${runsPath}/options`);
    if (options.includedRespondents === 0) throw new Error('the demo study has no respondents');
    if (!options.columns.some((c) => c.isCost))
      throw new Error('the demo study has no cost column (monthly bill increase)');
    for (const model of ['mnl', 'mixed'] as const) {
      const run = await request<Run>('POST', runsPath, buildDemoRunInput(options, model));
      console.log(
        `  Demo run started: ${run.name} (${run.spec.coefficients.length} coefficients, ` +
          `${options.includedRespondents} respondents); progress in the study's Models section.`,
      );
    }
    return;
  }
  throw new Error(`the analyst sees no study named "${DEMO_STUDY_NAME}"`);
}

startDemoRuns().catch((err: unknown) => {
  // fetch hides the reason (e.g. ECONNREFUSED) in `cause`.
  const cause = err instanceof Error && err.cause instanceof Error ? `: ${err.cause.message}` : '';
  const message = err instanceof Error ? err.message : String(err);
  console.warn(`  Warning: demo runs not started (${message}${cause}).`);
  process.exitCode = 0;
});
