/**
 * The web process: validates configuration, migrates the database, listens. With
 * EMBEDDED_WORKER=true (the default for a single machine) it also works off the job queue,
 * with design and estimation on worker threads, never on this thread; more workers can run
 * elsewhere with `npm run worker`. With WEB_INSTANCES > 1 this process migrates, then runs
 * that many web processes on the same port and supervises them (server/web-cluster.ts).
 */
import cluster from 'node:cluster';
import { loadEnv, type Env } from './env';
import { createLogger, type Logger } from './lib/logger';
import { createProcessDb } from './lib/database';
import { installProcessGuards } from './lib/process-guards';
import { stopOnSignals } from './lib/stop-on-signals';
import { reportEventLoopDelay, relayEventLoopDelay } from './lib/event-loop-delay';
import { closeHttp, createHttpServer, listenHttp } from './lib/http-listen';
import { retryWhileDatabaseUnavailable } from './lib/db-retry';
import { migrateDb, type Db } from '../db/client';
import { createMailer } from './mail/mailer';
import { createApp } from './app';
import { startBackgroundServices } from './jobs/background';
import { startWebCluster } from './web-cluster';
import { startFieldworkBusySignal } from './lib/fieldwork-busy';

/** Migrates, waiting out a database that is slow to accept connections (a busy or restarting server). */
function migrate(db: Db, logger: Logger) {
  return retryWhileDatabaseUnavailable(() => migrateDb(db), {
    onRetry: (err) =>
      logger.warn({ message: (err as Error).message }, 'database unreachable; migrating again'),
  });
}

async function runPrimary(env: Env, logger: Logger) {
  installProcessGuards(logger, 'web cluster primary');
  // Migrate once, before any web process starts (migrateDb holds one connection for its lock
  // and migrates on another).
  const { db, pool } = createProcessDb(env, logger, {
    max: 2,
    applicationName: 'choicewright-web-primary',
  });
  await migrate(db, logger);
  await pool.end();
  const webCluster = startWebCluster({
    instances: env.WEB_INSTANCES,
    embeddedWorker: env.EMBEDDED_WORKER,
    logger,
  });
  relayEventLoopDelay(() => webCluster.workers());
  logger.info({ pid: process.pid, instances: env.WEB_INSTANCES }, 'web processes starting');
  stopOnSignals(logger, 'stopping the web processes', [() => webCluster.stop()]);
}

async function main() {
  const env = loadEnv();
  const logger = createLogger(env.LOG_LEVEL);
  if (env.WEB_INSTANCES > 1 && cluster.isPrimary) return runPrimary(env, logger);
  installProcessGuards(logger, 'web process');
  const { db, pool } = createProcessDb(env, logger, { applicationName: 'choicewright-web' });
  if (cluster.isPrimary) await migrate(db, logger);
  const mailer = createMailer(env);
  // Only where estimations share this process with the requests (the embedded worker).
  const busy =
    env.EMBEDDED_WORKER && env.ENGINE_YIELD_UTILISATION > 0
      ? startFieldworkBusySignal({ threshold: env.ENGINE_YIELD_UTILISATION })
      : null;
  const deps = { env, db, logger, mailer, fieldworkBusy: busy?.flag };
  const app = createApp(deps);
  const stopBackground = await startBackgroundServices(deps, {
    embeddedWorker: env.EMBEDDED_WORKER,
  });
  const server = await listenHttp(createHttpServer(app), { port: env.PORT, host: env.HOST });
  const stopDelay = reportEventLoopDelay();
  logger.info({ pid: process.pid }, `Choicewright listening on ${env.APP_URL}`);
  stopOnSignals(logger, 'shutting down', [
    stopDelay,
    () => busy?.stop(),
    () => closeHttp(server),
    stopBackground,
    () => mailer.close(),
    () => pool.end(),
  ]);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
