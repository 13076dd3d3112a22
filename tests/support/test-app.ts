/**
 * The API in-process against a real PostgreSQL database of its own, with mail going to the
 * fake SMTP server the global setup started (read back through tests/support/mailbox.ts).
 */
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, beforeEach } from 'vitest';
import supertest from 'supertest';
import type { Express } from 'express';
import type { DestinationStream } from 'pino';
import { createApp } from '../../server/app';
import { loadEnv } from '../../server/env';
import { createLogger } from '../../server/lib/logger';
import { createMailer } from '../../server/mail/mailer';
import type { AppDeps } from '../../server/deps';
import { startJobQueue, type JobQueue, type RegisteredJobKind } from '../../server/jobs/queue';
import { createJobKinds } from '../../server/jobs/background';
import { createTestDb, type TestDb } from './test-db';
import { createDb } from '../../db/client';
import { startTcpProxy, throughProxy, type TcpProxy } from './tcp-proxy';
import { createTeamWithAllRoles, signUpOwner } from './factories';

export type TestApp = {
  app: Express;
  deps: AppDeps;
  testDb: TestDb;
  request: () => supertest.Agent;
  close(): Promise<void>;
};

export type TestAppOptions = {
  /** The app reaches its database through this proxy (fault tests); `testDb.db` stays direct. */
  viaProxy?: TcpProxy;
  /** The app logs at info there. */
  logDestination?: DestinationStream;
  /** An existing database to use as it is (not cloned, not dropped on close). */
  databaseUrl?: string;
};

/** The settings of the test apps, `overrides` on top. */
export function testEnv(databaseUrl: string, overrides: Record<string, string> = {}) {
  return loadEnv({
    NODE_ENV: 'test',
    DATABASE_URL: databaseUrl,
    JWT_SECRET: 'test-secret-test-secret-test-secret-0123456789',
    APP_URL: 'http://127.0.0.1:5999',
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: process.env.CW_TEST_SMTP_PORT ?? '1025',
    LOG_LEVEL: 'silent',
    AUTH_RATE_LIMIT: '10000',
    EMBEDDED_WORKER: 'false',
    // Engine threads at normal priority: test files run side by side and should share fairly.
    ENGINE_THREAD_NICE: '0',
    ...overrides,
  });
}

async function openDatabase(url: string | undefined): Promise<TestDb> {
  if (!url) return createTestDb();
  const { db, pool } = createDb(url, 3);
  return { db, url, close: () => pool.end() };
}

export async function createTestApp(
  overrides: Record<string, string> = {},
  options: TestAppOptions = {},
): Promise<TestApp> {
  const testDb = await openDatabase(options.databaseUrl);
  const env = testEnv(testDb.url, overrides);
  const mailer = createMailer(env);
  const proxied = options.viaProxy
    ? createDb(throughProxy(testDb.url, options.viaProxy), { max: 5, connectTimeoutMs: 1000 })
    : null;
  const db = proxied?.db ?? testDb.db;
  const logger = options.logDestination
    ? createLogger('info', options.logDestination)
    : createLogger('silent');
  const deps: AppDeps = { env, db, logger, mailer };
  const app = createApp(deps);
  // One listening server for the file's requests: supertest given the app itself starts and
  // closes a server of its own for every request.
  const server = http.createServer(app);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return {
    app,
    deps,
    testDb,
    // As the app's own pages do: browsers send Origin on every state-changing request.
    request: () => supertest.agent(server).set('Origin', env.APP_URL),
    async close() {
      const closed = new Promise((resolve) => server.close(resolve));
      server.closeAllConnections();
      await closed;
      mailer.close();
      await proxied?.pool.end();
      await testDb.close();
    },
  };
}

type Team = Awaited<ReturnType<typeof createTeamWithAllRoles>>;

export type UseTestAppOptions<S extends SignIn> = Omit<TestAppOptions, 'viaProxy'> & {
  /** Who is signed in before the file's tests: one team owner, or every role of a team. */
  signIn?: S;
  /** The app reaches its database through a TCP proxy the test controls (`t.proxy`). */
  faultProxy?: boolean;
  /** A data folder of the file's own (`DATA_DIR`, at `t.dataDir`), removed afterwards. */
  dataDir?: boolean;
  /** The real pg-boss queue on the file's database as the app's `jobs` (`t.queue`). */
  jobQueue?: { work: boolean; kinds?: () => RegisteredJobKind[] };
  /** The app's jobs are only kept, in `t.sent` (emptied before each test), never run. */
  recordJobs?: boolean;
};
/** A job the app sent while `recordJobs` held it. */
export type SentJob = { name: string; data: { runId?: string } & Record<string, unknown> };
type SignIn = 'owner' | 'team' | undefined;
type SignedIn<S extends SignIn> = S extends 'owner'
  ? { owner: supertest.Agent; teamId: string }
  : S extends 'team'
    ? { team: Team }
    : unknown;
export type FileTestApp<S extends SignIn = undefined> = TestApp &
  SignedIn<S> & { proxy: TcpProxy; dataDir: string; queue: JobQueue; sent: SentJob[] };

/**
 * The usual set-up of an API test file: one test app for the whole file, created before its
 * tests and closed after them, with what `options` asks for. The returned object is filled in
 * by the `beforeAll`, so read its fields inside hooks and tests only. A file's own `afterAll`
 * hooks run before this one closes the app (vitest runs after-hooks in reverse order of
 * registration).
 */
export function useTestApp<S extends SignIn = undefined>(
  overrides: Record<string, string> = {},
  options: UseTestAppOptions<S> = {},
): FileTestApp<S> {
  const { signIn, faultProxy, dataDir, jobQueue, recordJobs, ...appOptions } = options;
  const t = {} as FileTestApp<'owner'> & FileTestApp<'team'>;
  beforeAll(async () => {
    if (faultProxy) {
      const pg = new URL(process.env.CW_TEST_ADMIN_URL!);
      t.proxy = await startTcpProxy({ host: pg.hostname, port: Number(pg.port) });
    }
    if (dataDir) t.dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-data-'));
    const env = dataDir ? { DATA_DIR: t.dataDir, ...overrides } : overrides;
    Object.assign(t, await createTestApp(env, { ...appOptions, viaProxy: t.proxy }));
    if (signIn === 'owner') ({ agent: t.owner, teamId: t.teamId } = await signUpOwner(t));
    if (signIn === 'team') t.team = await createTeamWithAllRoles(t);
    if (jobQueue) {
      const kinds = (jobQueue.kinds ?? createJobKinds)();
      t.queue = await startJobQueue(t.deps, { kinds, work: jobQueue.work });
      t.deps.jobs = t.queue;
    }
  });
  if (recordJobs)
    beforeEach(() => {
      const sent: SentJob[] = [];
      t.sent = sent;
      t.deps.jobs = {
        send: async (name, data) => {
          sent.push({ name, data: data as SentJob['data'] });
        },
      };
    });
  afterAll(async () => {
    await t.queue?.stop();
    await t.close?.();
    await t.proxy?.close();
    if (t.dataDir) fs.rmSync(t.dataDir, { recursive: true, force: true });
  });
  return t as unknown as FileTestApp<S>;
}
