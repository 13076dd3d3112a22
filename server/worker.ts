/**
 * `npm run worker`: a process that only works off the job queue (design generation,
 * estimation runs, mail), for when the web process runs with EMBEDDED_WORKER=false or more
 * capacity is needed. Design and estimation run on worker threads here too.
 */
import { loadEnv } from './env';
import { createLogger } from './lib/logger';
import { createProcessDb } from './lib/database';
import { installProcessGuards } from './lib/process-guards';
import { stopOnSignals } from './lib/stop-on-signals';
import { migrateDb } from '../db/client';
import { createMailer } from './mail/mailer';
import { startBackgroundServices } from './jobs/background';

async function main() {
  const env = loadEnv();
  const logger = createLogger(env.LOG_LEVEL);
  installProcessGuards(logger, 'worker');
  const { db, pool } = createProcessDb(env, logger, {
    max: 6,
    applicationName: 'choicewright-worker',
  });
  await migrateDb(db);
  const mailer = createMailer(env);
  const stop = await startBackgroundServices({ env, db, logger, mailer }, { embeddedWorker: true });
  logger.info({ pid: process.pid }, 'Choicewright worker running');
  stopOnSignals(logger, 'worker shutting down', [stop, () => mailer.close(), () => pool.end()]);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
