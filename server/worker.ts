/**
 * `npm run worker`: a process that only runs background jobs (design generation, estimation
 * runs), for when the web process runs with EMBEDDED_WORKER=false or more capacity is needed.
 */
import { loadEnv } from './env';
import { createLogger } from './lib/logger';
import { createDb, migrateDb } from '../db/client';
import { createMailer } from './mail/mailer';
import { startBackgroundServices } from './jobs/background';

async function main() {
  const env = loadEnv();
  const logger = createLogger(env.LOG_LEVEL);
  const { db, pool } = createDb(env.DATABASE_URL, 6);
  await migrateDb(db);
  const mailer = createMailer(env);
  const stop = await startBackgroundServices({ env, db, logger, mailer }, { embeddedWorker: true });
  logger.info('Choicewright worker running');
  let stopping = false;
  const shutdown = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.info({ signal }, 'worker shutting down');
    await stop();
    mailer.close();
    await pool.end();
    process.exit(0);
  };
  process.on('SIGINT', () => void shutdown('SIGINT'));
  process.on('SIGTERM', () => void shutdown('SIGTERM'));
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
