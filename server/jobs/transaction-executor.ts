/**
 * pg-boss's `db` option over one of our Drizzle transactions, so that a job is enqueued in the
 * same transaction as the row that records it: both are committed, or neither. pg-boss hands
 * over SQL with $1…$n placeholders; each becomes a bound parameter (sql.param, so an array or
 * object value stays one parameter, as node-postgres would send it).
 */
import { sql, type SQL } from 'drizzle-orm';
import type PgBoss from 'pg-boss';
import type { DbOrTx } from '../../db/client';

export function transactionExecutor(tx: DbOrTx): PgBoss.Db {
  return {
    async executeSql(text: string, values: unknown[] = []) {
      // split with a capture group alternates text and placeholder numbers.
      const chunks: SQL[] = text
        .split(/\$(\d+)/)
        .map((part, i) =>
          i % 2 === 0 ? sql.raw(part) : sql`${sql.param(values[Number(part) - 1])}`,
        );
      const result = await tx.execute(sql.join(chunks));
      return { rows: result.rows };
    },
  };
}
