/**
 * A digest of every row version of every table, to prove that a refused request changed
 * nothing. A row's version is its place in the table and the transaction that wrote it
 * (PostgreSQL's `ctid` and `xmin` system columns, "System Columns" in its manual): every
 * insert, update and delete makes or removes a version, even an update that writes the same
 * values, so this sees every change a digest of the rows' contents sees, and more. Reading
 * two small system columns instead of turning every row (studies carry kilobytes of JSON)
 * into sorted text cut a fingerprint's execution in the server from 6.3 ms to 0.6 ms (EXPLAIN
 * ANALYZE) once the matrix test had made some dozens of studies; it takes hundreds of them.
 * Locking a row sets its `xmax`, not these, and vacuum does not move live rows.
 *
 * Left out: tables that count requests rather than hold data (rate-limit counters). Sign-in
 * sessions are digested by content without their "last seen" stamp, which any authenticated
 * call refreshes (so their row versions change on every call).
 *
 * The tables and their columns are read once per database and turned into one statement, so
 * a fingerprint is one round trip; a prepared one, as planning its 27 branches took twice as
 * long as running them (1.8 ms against 0.8 ms, EXPLAIN ANALYZE): each connection plans it once.
 */
import { createHash } from 'node:crypto';
import { sql } from 'drizzle-orm';
import type { Db } from '../../db/client';

const SKIP_TABLES = new Set(['rate_limit_counters']);
const SKIP_COLUMNS: Record<string, string[]> = { user_sessions: ['last_seen_at'] };

type Statement = { name: string; text: string };
const statements = new WeakMap<Db, Promise<Statement>>();

async function buildStatement(db: Db): Promise<Statement> {
  const { rows } = await db.execute<{ table_name: string; columns: string[] }>(
    sql`select c.table_name, array_agg(c.column_name::text order by c.column_name) as columns
        from information_schema.columns c
        join information_schema.tables t
          on t.table_schema = c.table_schema and t.table_name = c.table_name
        where c.table_schema = 'public' and t.table_type = 'BASE TABLE'
        group by c.table_name order by c.table_name`,
  );
  const parts = rows
    .filter((r) => !SKIP_TABLES.has(r.table_name))
    .map(({ table_name: table, columns }) => {
      const skip = SKIP_COLUMNS[table];
      if (!skip)
        return `select '${table}' as t, (select md5(string_agg(ctid::text || xmin::text, '|'
                order by ctid)) from "${table}") as d`;
      const list = columns
        .filter((c) => !skip.includes(c))
        .map((c) => `"${c}"`)
        .join(', ');
      return `select '${table}' as t, (select md5(string_agg(r::text, '|' order by r::text))
              from (select ${list} from "${table}") r) as d`;
    });
  const text = parts.join('\nunion all\n');
  // Named by its text: a connection never sees two statements under one name.
  return {
    name: `cw_fingerprint_${createHash('sha256').update(text).digest('hex').slice(0, 16)}`,
    text,
  };
}

export async function databaseFingerprint(db: Db): Promise<Record<string, string>> {
  let statement = statements.get(db);
  if (!statement) {
    statement = buildStatement(db);
    statements.set(db, statement);
  }
  const { rows } = await db.$client.query<{ t: string; d: string | null }>(await statement);
  const out: Record<string, string> = {};
  for (const { t, d } of rows) out[t] = d ?? 'empty';
  return out;
}
