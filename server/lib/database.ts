/**
 * The process's database pool, configured from the validated settings, with broken
 * connections logged (they are replaced on the next query; see db/client.ts).
 */
import { createDb } from '../../db/client';
import type { Env } from '../env';
import type { Logger } from './logger';

export function createProcessDb(
  env: Pick<
    Env,
    | 'DATABASE_URL'
    | 'DB_POOL_SIZE'
    | 'DB_CONNECT_TIMEOUT_MS'
    | 'DB_STATEMENT_TIMEOUT_MS'
    | 'DB_IDLE_IN_TRANSACTION_TIMEOUT_MS'
  >,
  logger: Logger,
  opts: { max?: number; applicationName: string },
) {
  return createDb(env.DATABASE_URL, {
    max: opts.max ?? env.DB_POOL_SIZE,
    connectTimeoutMs: env.DB_CONNECT_TIMEOUT_MS,
    statementTimeoutMs: env.DB_STATEMENT_TIMEOUT_MS,
    idleInTransactionTimeoutMs: env.DB_IDLE_IN_TRANSACTION_TIMEOUT_MS,
    applicationName: opts.applicationName,
    onError: (err) =>
      logger.warn(
        { err: { message: err.message, code: (err as { code?: string }).code } },
        'database connection lost; it will be replaced',
      ),
  });
}
