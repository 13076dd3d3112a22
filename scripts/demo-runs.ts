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
import type { StudySummary } from '../shared/schemas/study';
import type { CreateRunInput, Run, RunOptions } from '../shared/schemas/run';
import {
  getColumnDefault,
  getDefaultRunFormValues,
  toCreateRunInput,
} from '../src/features/runs/utils/run-form-values';

const DEMO_STUDY_NAME = 'Water service packages 2027–2031';
// Modest but sound: enough Halton draws for stable estimates of five random tastes on ~400
// respondents, and quick enough on a two-core machine to finish a few minutes after the start.
const DRAWS = 200;
const PROFILE_DRAWS = 1000;
const SEED = 1;

const root = path.resolve(import.meta.dirname, '..');
const baseUrl = (process.env.APP_URL ?? 'http://127.0.0.1:5180').replace(/\/+$/, '');
const credentialsFile =
  process.env.CW_DEMO_CREDENTIALS_FILE ?? path.join(root, '.data', 'demo-credentials.json');

type Credential = { role: string; email: string; password: string };

/** A tiny JSON client that keeps the session cookie the sign-in sets. */
function createClient() {
  let cookie = '';
  return async function request<T>(method: string, url: string, body?: unknown): Promise<T> {
    const res = await fetch(`${baseUrl}/api${url}`, {
      method,
      headers: {
        Accept: 'application/json',
        // The server refuses state-changing requests that carry a session without an Origin.
        Origin: baseUrl,
        ...(body === undefined ? {} : { 'Content-Type': 'application/json' }),
        ...(cookie ? { Cookie: cookie } : {}),
      },
      body: body === undefined ? undefined : JSON.stringify(body),
      signal: AbortSignal.timeout(30_000),
    });
    const setCookies = res.headers.getSetCookie();
    if (setCookies.length > 0) cookie = setCookies.map((c) => c.split(';')[0]).join('; ');
    const text = await res.text();
    if (!res.ok) {
      let message = text.slice(0, 300);
      try {
        message = (JSON.parse(text) as { error?: { message?: string } }).error?.message ?? message;
      } catch {
        // not JSON: keep the raw text
      }
      throw new Error(`${method} ${url} answered ${res.status}: ${message}`);
    }
    return (text ? JSON.parse(text) : undefined) as T;
  };
}

function readAnalyst(): Credential {
  const list = JSON.parse(readFileSync(credentialsFile, 'utf8')) as Credential[];
  const analyst = list.find((c) => c.role === 'analyst');
  if (!analyst) throw new Error(`no analyst sign-in in ${credentialsFile}`);
  return analyst;
}

/** The form's create-run input for `model`, with its default column choices and our draws. */
function buildRunInput(options: RunOptions, model: 'mnl' | 'mixed'): CreateRunInput {
  const values = {
    ...getDefaultRunFormValues(options),
    model,
    columns: options.columns.map((c) => ({ distribution: getColumnDefault(c, model) })),
    drawsType: 'halton' as const,
    drawsCount: DRAWS,
    profileDraws: PROFILE_DRAWS,
    seed: SEED,
  };
  return toCreateRunInput(values, options.columns);
}

async function startDemoRuns(): Promise<void> {
  const request = createClient();
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
      const run = await request<Run>('POST', runsPath, buildRunInput(options, model));
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
