/**
 * Database connection: one pg pool per process, wrapped by Drizzle.
 *
 * The pool survives database faults instead of ending the process: a connection that breaks
 * (a PostgreSQL restart, pg_terminate_backend, a network cut) is reported through `onError`
 * and dropped, and the next query opens a fresh one. Every connection carries a statement
 * timeout and an idle-in-transaction timeout, so a stuck query or an abandoned transaction
 * cannot hold locks and connections for ever, and connecting gives up after a few seconds so
 * requests fail fast (503) while the server is unreachable.
 */
import pg from 'pg';
import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import path from 'node:path';
import * as schema from './schema/index';

export type Db = NodePgDatabase<typeof schema> & { $client: pg.Pool };
/** A transaction handle has the same query surface as the database. */
export type DbOrTx = Db | Parameters<Parameters<Db['transaction']>[0]>[0];

export type DbOptions = {
  /** Connections in the pool. */
  max?: number;
  /** Give up opening a connection after this long. */
  connectTimeoutMs?: number;
  /** PostgreSQL cancels a statement running longer than this. */
  statementTimeoutMs?: number;
  /** PostgreSQL ends a session left idle inside a transaction this long (its locks go too). */
  idleInTransactionTimeoutMs?: number;
  /** Shown in pg_stat_activity. */
  applicationName?: string;
  /** A connection broke outside a query; it has been dropped from the pool. */
  onError?: (err: Error) => void;
};

export const DB_DEFAULTS = {
  connectTimeoutMs: 5_000,
  statementTimeoutMs: 30_000,
  idleInTransactionTimeoutMs: 15_000,
} as const;

export function createDb(url: string, options: DbOptions | number = {}): { db: Db; pool: pg.Pool } {
  const o = typeof options === 'number' ? { max: options } : options;
  const pool = new pg.Pool({
    connectionString: url,
    max: o.max ?? 10,
    connectionTimeoutMillis: o.connectTimeoutMs ?? DB_DEFAULTS.connectTimeoutMs,
    statement_timeout: o.statementTimeoutMs ?? DB_DEFAULTS.statementTimeoutMs,
    idle_in_transaction_session_timeout:
      o.idleInTransactionTimeoutMs ?? DB_DEFAULTS.idleInTransactionTimeoutMs,
    application_name: o.applicationName ?? 'choicewright',
    keepAlive: true,
  });
  const onError = o.onError ?? (() => {});
  // An idle pooled connection that breaks emits 'error' on the pool; without a listener
  // Node ends the process.
  pool.on('error', onError);
  // A checked-out connection that breaks between two queries of a transaction emits 'error'
  // on the client itself, where pg-pool listens only while the client is idle. The query
  // that follows fails and the pool discards the client when it is released.
  pool.on('connect', (client) => client.on('error', onError));
  return { db: drizzle(pool, { schema }) as Db, pool };
}

/** Arbitrary key of the advisory lock that serialises migrations. */
const MIGRATION_LOCK_KEY = 7_243_115;

/**
 * Applies the committed migrations. Several processes may start at once (API instances and
 * workers); a session advisory lock lets one migrate while the others wait and then find
 * nothing left to do.
 */
export async function migrateDb(db: Db): Promise<void> {
  const lock = await db.$client.connect();
  try {
    await lock.query('select pg_advisory_lock($1)', [MIGRATION_LOCK_KEY]);
    await migrate(db, { migrationsFolder: path.resolve(import.meta.dirname, 'migrations') });
  } finally {
    await lock.query('select pg_advisory_unlock($1)', [MIGRATION_LOCK_KEY]).catch(() => {});
    lock.release();
  }
}
