/**
 * The web process: validates configuration, migrates the database, listens. With
 * EMBEDDED_WORKER=true (the default for a single machine) it also runs the job workers;
 * more workers can run elsewhere with `npm run worker`.
 */
import { loadEnv } from './env';
import { createLogger } from './lib/logger';
import { createDb, migrateDb } from '../db/client';
import { createMailer } from './mail/mailer';
import { createApp } from './app';
import { startBackgroundServices } from './jobs/background';

async function main() {
  const env = loadEnv();
  const logger = createLogger(env.LOG_LEVEL);
  const { db, pool } = createDb(env.DATABASE_URL, 20);
  await migrateDb(db);
  const mailer = createMailer(env);
  const deps = { env, db, logger, mailer };
  const app = createApp(deps);
  const stopBackground = await startBackgroundServices(deps, {
    embeddedWorker: env.EMBEDDED_WORKER,
  });
  const server = app.listen(env.PORT, env.HOST, () => {
    logger.info(`Choicewright listening on ${env.APP_URL}`);
  });
  let stopping = false;
  const shutdown = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.info({ signal }, 'shutting down');
    server.close();
    await stopBackground();
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
