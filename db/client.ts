/** Database connection: one pg pool per process, wrapped by Drizzle. */
import pg from 'pg';
import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import path from 'node:path';
import * as schema from './schema/index';

export type Db = NodePgDatabase<typeof schema>;
/** A transaction handle has the same query surface as the database. */
export type DbOrTx = Db | Parameters<Parameters<Db['transaction']>[0]>[0];

export function createDb(url: string, max = 10): { db: Db; pool: pg.Pool } {
  const pool = new pg.Pool({ connectionString: url, max });
  return { db: drizzle(pool, { schema }), pool };
}

export async function migrateDb(db: Db): Promise<void> {
  await migrate(db, { migrationsFolder: path.resolve(import.meta.dirname, 'migrations') });
}
