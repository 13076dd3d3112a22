/**
 * pg-boss's `db` option over one of our Drizzle transactions, so that a job is enqueued in the
 * same transaction as the row that records it: both are committed, or neither.
 *
 * pg-boss's SQL must reach PostgreSQL as written: it uses one placeholder several times with
 * different casts (e.g. start_after as text, timestamp or interval), which only works when the
 * placeholder is one parameter. Drizzle would number each use apart, so the SQL goes to the
 * transaction's own node-postgres client instead (the client Drizzle's session holds; checked
 * here, and tests/server/jobs/orphan-sweep.test.ts commits and rolls back through it).
 */
import type PgBoss from 'pg-boss';
import type { DbOrTx } from '../../db/client';

type Queryable = {
  query(text: string, values: unknown[]): Promise<{ rows: unknown[] }>;
};

function clientOf(tx: DbOrTx): Queryable {
  const client = (tx as unknown as { session?: { client?: Partial<Queryable> } }).session?.client;
  if (typeof client?.query !== 'function')
    throw new Error('transactionExecutor: no node-postgres client behind this transaction');
  return client as Queryable;
}

export function transactionExecutor(tx: DbOrTx): PgBoss.Db {
  const client = clientOf(tx);
  return {
    async executeSql(text: string, values: unknown[] = []) {
      const result = await client.query(text, values);
      return { rows: result.rows };
    },
  };
}
