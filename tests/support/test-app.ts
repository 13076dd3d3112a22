/**
 * The API in-process against a real PostgreSQL database of its own, with mail going to the
 * fake SMTP server the global setup started (read back through tests/support/mailbox.ts).
 */
import { afterAll, beforeAll } from 'vitest';
import supertest from 'supertest';
import type { Express } from 'express';
import { createApp } from '../../server/app';
import { loadEnv } from '../../server/env';
import { createLogger } from '../../server/lib/logger';
import type { DestinationStream } from 'pino';
import { createMailer } from '../../server/mail/mailer';
import type { AppDeps } from '../../server/deps';
import { createTestDb, type TestDb } from './test-db';
import { createDb } from '../../db/client';
import { throughProxy, type TcpProxy } from './tcp-proxy';

export type TestApp = {
  app: Express;
  deps: AppDeps;
  testDb: TestDb;
  request: () => supertest.Agent;
  close(): Promise<void>;
};

/**
 * `viaProxy`: the app reaches its database through a TCP proxy the test controls (fault
 * tests); the test's own `testDb.db` stays direct. `logDestination`: the app logs at info there.
 */
export async function createTestApp(
  overrides: Record<string, string> = {},
  options: { viaProxy?: TcpProxy; logDestination?: DestinationStream } = {},
): Promise<TestApp> {
  const testDb = await createTestDb();
  const env = loadEnv({
    NODE_ENV: 'test',
    DATABASE_URL: testDb.url,
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
  return {
    app,
    deps,
    testDb,
    // As the app's own pages do: browsers send Origin on every state-changing request.
    request: () => supertest.agent(app).set('Origin', env.APP_URL),
    async close() {
      mailer.close();
      await proxied?.pool.end();
      await testDb.close();
    },
  };
}

/**
 * The usual set-up of an API test file: one test app for the whole file, created before its
 * tests and closed after them. The returned object is filled in by the `beforeAll`, so read its
 * fields inside hooks and tests only. A file's own `afterAll` hooks run before this one closes
 * the app (vitest runs after-hooks in reverse order of registration).
 */
export function useTestApp(
  overrides: Record<string, string> = {},
  options: { viaProxy?: TcpProxy; logDestination?: DestinationStream } = {},
): TestApp {
  const t = {} as TestApp;
  beforeAll(async () => {
    Object.assign(t, await createTestApp(overrides, options));
  });
  afterAll(async () => {
    await t.close?.();
  });
  return t;
}
