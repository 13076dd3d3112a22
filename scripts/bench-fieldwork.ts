/**
 * Fieldwork load benchmark. Starts the app in-process (createApp on port 0) against a database
 * of its own created in the project cluster (never the demo database), puts a 10-task study
 * live, and lets N respondents (default 200) answer it concurrently over loopback with
 * keep-alive fetch: start a session, consent, ten choice tasks. About one answer in ten is sent
 * a second time with the same client id (a client retry). Prints requests per second, the
 * answer endpoint's p50/p95/p99 latency and the count check (answers stored = answers sent,
 * no duplicates); `--json` prints one JSON line.
 * Usage: npm run bench:fieldwork [-- --respondents 200] [-- --json]
 */
import { execFileSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import os from 'node:os';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import { sql } from 'drizzle-orm';
import { createApp } from '../server/app';
import { loadEnv } from '../server/env';
import { createLogger } from '../server/lib/logger';
import type { AppDeps } from '../server/deps';
import type { Mailer } from '../server/mail/mailer';
import { createDb, migrateDb, type Db } from '../db/client';
import { databaseUrl, dropDatabase } from '../tests/support/template-db';
import { insertTeam } from '../db/queries/memberships';
import { designs, studies } from '../db/schema/studies';
import { goLive } from '../server/services/lifecycle';
import { createRespondentLoad, summarise } from './bench-fieldwork-load';
import pg from 'pg';

const args = process.argv.slice(2);
const asJson = args.includes('--json');
const respondentsArg = args.indexOf('--respondents');
const RESPONDENTS = respondentsArg >= 0 ? Number(args[respondentsArg + 1]) : 200;
const TASKS = 10;
const RETRY_SHARE = 0.1;

const root = path.resolve(import.meta.dirname, '..');
const log = (s: string) => {
  if (!asJson) console.log(s);
};

function adminUrl(): string {
  if (process.env.DATABASE_URL) return process.env.DATABASE_URL;
  execFileSync(path.join(root, 'scripts/pg.sh'), ['start'], {
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  return execFileSync(path.join(root, 'scripts/pg.sh'), ['url', 'postgres']).toString().trim();
}

const lv = (prefix: string, labels: string[], values?: number[]) =>
  labels.map((label, i) => ({
    id: `${prefix}${i}`,
    label,
    ...(values ? { value: values[i] } : {}),
  }));

/** Three attributes, two unlabeled alternatives, ten distinct tasks in one block. */
const definition = {
  attributes: [
    {
      id: 'bill',
      name: 'Monthly bill increase',
      kind: 'numeric',
      unit: '€',
      isCost: true,
      coding: 'linear',
      levels: lv('b', ['€0', '€5', '€10'], [0, 5, 10]),
    },
    {
      id: 'cuts',
      name: 'Supply interruptions per year',
      kind: 'numeric',
      coding: 'linear',
      levels: lv('c', ['4', '2', '1'], [4, 2, 1]),
    },
    {
      id: 'river',
      name: 'River health',
      kind: 'categorical',
      coding: 'dummy',
      levels: lv('r', ['poor', 'fair', 'good']),
    },
  ],
  alternatives: { count: 2, labeled: false, labels: [] },
  fixedAlternative: null,
  excludedCombinations: [],
};
const design = {
  blocks: 1,
  tasks: Array.from({ length: TASKS }, (_, t) => ({
    block: 1,
    task: t + 1,
    alternatives: [0, 1].map((j) => ({
      levels: {
        bill: `b${(t + j) % 3}`,
        cuts: `c${(t + 2 * j) % 3}`,
        river: `r${(Math.floor(t / 3) + j) % 3}`,
      },
    })),
  })),
};
const questionnaire = {
  pages: [
    {
      id: 'consent',
      kind: 'consent',
      title: 'Welcome',
      body: 'A load test.',
      agreeLabel: 'I agree',
    },
    { id: 'tasks', kind: 'tasks', title: 'Which package would you choose?' },
    { id: 'end', kind: 'end', title: 'Thank you', body: 'Done.' },
  ],
};

async function createLiveStudy(deps: AppDeps): Promise<{ publicId: string; studyId: string }> {
  const team = await insertTeam(deps.db, { name: 'Bench team' });
  const publicId = randomBytes(9).toString('base64url');
  const [study] = await deps.db
    .insert(studies)
    .values({ teamId: team.id, publicId, name: 'Bench study', definition, questionnaire })
    .returning({ id: studies.id });
  const [d] = await deps.db
    .insert(designs)
    .values({ studyId: study.id, teamId: team.id, method: 'imported', design })
    .returning({ id: designs.id });
  await deps.db
    .update(studies)
    .set({ currentDesignId: d.id })
    .where(sql`${studies.id} = ${study.id}`);
  await goLive(deps, team.id, study.id);
  return { publicId, studyId: study.id };
}

async function countStored(db: Db, studyId: string) {
  const r = await db.execute<{ rows: string; distinct_rows: string; distinct_clients: string }>(sql`
    select count(*) as rows,
           count(distinct (respondent_id, screen_key)) as distinct_rows,
           count(distinct (respondent_id, client_id)) as distinct_clients
      from answers where study_id = ${studyId}`);
  const row = r.rows[0];
  return {
    rows: Number(row.rows),
    distinctScreens: Number(row.distinct_rows),
    distinctClientIds: Number(row.distinct_clients),
  };
}

async function main() {
  const admin = adminUrl();
  const dbName = `cw_bench_${randomBytes(4).toString('hex')}`;
  const c = new pg.Client({ connectionString: admin });
  await c.connect();
  await c.query(`create database "${dbName}"`);
  await c.end();
  const url = databaseUrl(admin, dbName);
  const { db, pool } = createDb(url, 20);
  // Idle connections are cut when the scratch database is dropped at the end; not an error.
  pool.on('error', () => {});
  const noMail: Mailer = { send: async () => {}, close: () => {} };
  try {
    await migrateDb(db);
    const env = loadEnv({
      NODE_ENV: 'production',
      DATABASE_URL: url,
      JWT_SECRET: randomBytes(32).toString('hex'),
      APP_URL: 'http://127.0.0.1:0',
      LOG_LEVEL: 'silent',
      EMBEDDED_WORKER: 'false',
      RESPONDENT_START_RATE_LIMIT: String(RESPONDENTS * 10),
      DATA_DIR: path.join(root, '.data', 'bench'),
    });
    const deps: AppDeps = { env, db, logger: createLogger('silent'), mailer: noMail };
    const { publicId, studyId } = await createLiveStudy(deps);
    const server = createApp(deps).listen(0, '127.0.0.1');
    await new Promise<void>((r) => server.once('listening', () => r()));
    const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    log(`bench:fieldwork — ${RESPONDENTS} concurrent respondents, ${TASKS} tasks each, ${base}`);

    const load = createRespondentLoad({ base, publicId, retryShare: RETRY_SHARE, seed: 7 });
    const t0 = performance.now();
    await Promise.all(Array.from({ length: RESPONDENTS }, (_, i) => load.runRespondent(i)));
    const seconds = (performance.now() - t0) / 1000;
    await new Promise<void>((r) => server.close(() => r()));

    const stored = await countStored(db, studyId);
    const s = summarise(load.metrics, seconds);
    const expectedAnswers = RESPONDENTS * (TASKS + 1);
    const result = {
      respondents: RESPONDENTS,
      tasks: TASKS,
      seconds: Number(seconds.toFixed(2)),
      requests: s.requests,
      requestsPerSecond: Math.round(s.requestsPerSecond),
      answerLatencyMs: s.answerLatency,
      sessionLatencyMs: s.sessionLatency,
      answersSent: load.metrics.uniqueAnswers,
      retriesSent: load.metrics.retries,
      retriesReplayed: load.metrics.replays,
      errors: load.metrics.errors,
      answersStored: stored.rows,
      countCheck:
        stored.rows === load.metrics.uniqueAnswers &&
        stored.rows === expectedAnswers &&
        stored.distinctScreens === stored.rows &&
        stored.distinctClientIds === stored.rows &&
        load.metrics.replays === load.metrics.retries &&
        load.metrics.errors === 0,
      node: process.version,
      cpus: os.cpus().length,
      /** Other processes share the machine; the 1-minute load average says how busy it was. */
      loadAverage1m: Number(os.loadavg()[0].toFixed(2)),
    };
    if (asJson) console.log(JSON.stringify(result));
    else {
      log(
        `  wall time          ${result.seconds} s (load average ${result.loadAverage1m} on ${result.cpus} CPUs)`,
      );
      log(`  requests           ${result.requests} (${result.requestsPerSecond} per second)`);
      log(
        `  answer latency     p50 ${s.answerLatency.p50} ms · p95 ${s.answerLatency.p95} ms · p99 ${s.answerLatency.p99} ms`,
      );
      log(`  session start      p50 ${s.sessionLatency.p50} ms · p95 ${s.sessionLatency.p95} ms`);
      log(
        `  count check        sent ${result.answersSent} + ${result.retriesSent} retries (${result.retriesReplayed} replayed), stored ${result.answersStored}, expected ${expectedAnswers}, errors ${result.errors} → ${result.countCheck ? 'OK' : 'MISMATCH'}`,
      );
    }
    if (!result.countCheck) process.exitCode = 1;
  } finally {
    await pool.end();
    await dropDatabase(admin, dbName);
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
