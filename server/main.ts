/**
 * The web process: validates configuration, migrates the database, listens. With
 * EMBEDDED_WORKER=true (the default for a single machine) it also works off the job queue,
 * with design and estimation on worker threads, never on this thread; more workers can run
 * elsewhere with `npm run worker`.
 */
import { loadEnv } from './env';
import { createLogger } from './lib/logger';
import { createProcessDb } from './lib/database';
import { installProcessGuards } from './lib/process-guards';
import { stopOnSignals } from './lib/stop-on-signals';
import { migrateDb } from '../db/client';
import { createMailer } from './mail/mailer';
import { createApp } from './app';
import { startBackgroundServices } from './jobs/background';

async function main() {
  const env = loadEnv();
  const logger = createLogger(env.LOG_LEVEL);
  installProcessGuards(logger, 'web process');
  const { db, pool } = createProcessDb(env, logger, { applicationName: 'choicewright-web' });
  await migrateDb(db);
  const mailer = createMailer(env);
  const deps = { env, db, logger, mailer };
  const app = createApp(deps);
  const stopBackground = await startBackgroundServices(deps, {
    embeddedWorker: env.EMBEDDED_WORKER,
  });
  const server = app.listen(env.PORT, env.HOST, () => {
    logger.info({ pid: process.pid }, `Choicewright listening on ${env.APP_URL}`);
  });
  stopOnSignals(logger, 'shutting down', [
    () => void server.close(),
    stopBackground,
    () => mailer.close(),
    () => pool.end(),
  ]);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
