/**
 * A digest of every row of every table, to prove that a refused request changed nothing.
 * Left out: tables that count requests rather than hold data (rate-limit counters), and the
 * "last seen" stamp of sign-in sessions, which any authenticated call refreshes.
 */
import { sql } from 'drizzle-orm';
import type { Db } from '../../db/client';

const SKIP_TABLES = new Set(['rate_limit_counters']);
const SKIP_COLUMNS: Record<string, string[]> = { user_sessions: ['last_seen_at'] };

export async function databaseFingerprint(db: Db): Promise<Record<string, string>> {
  const { rows } = await db.execute<{ table_name: string }>(
    sql`select table_name from information_schema.tables
        where table_schema = 'public' and table_type = 'BASE TABLE' order by table_name`,
  );
  const out: Record<string, string> = {};
  for (const { table_name: table } of rows) {
    if (SKIP_TABLES.has(table)) continue;
    const skip = SKIP_COLUMNS[table] ?? [];
    const { rows: cols } = await db.execute<{ column_name: string }>(
      sql`select column_name from information_schema.columns
          where table_schema = 'public' and table_name = ${table} order by column_name`,
    );
    const list = cols
      .map((c) => c.column_name)
      .filter((c) => !skip.includes(c))
      .map((c) => `"${c}"`)
      .join(', ');
    const { rows: digest } = await db.execute<{ d: string | null }>(
      sql.raw(`select md5(string_agg(r::text, '|' order by r::text)) as d
               from (select ${list} from "${table}") r`),
    );
    out[table] = digest[0]?.d ?? 'empty';
  }
  return out;
}
