/** Creation and removal of the per-run template database that API tests clone. */
import pg from 'pg';
import path from 'node:path';
import { drizzle } from 'drizzle-orm/node-postgres';
import { migrate } from 'drizzle-orm/node-postgres/migrator';

export function databaseUrl(adminUrl: string, database: string): string {
  const u = new URL(adminUrl);
  u.pathname = `/${database}`;
  return u.toString();
}

async function withAdmin<T>(adminUrl: string, fn: (c: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

export async function createTemplateDatabase(adminUrl: string, name: string): Promise<void> {
  await withAdmin(adminUrl, (c) => c.query(`create database "${name}"`));
  const pool = new pg.Pool({ connectionString: databaseUrl(adminUrl, name), max: 1 });
  try {
    await migrate(drizzle(pool), {
      migrationsFolder: path.resolve(import.meta.dirname, '../../db/migrations'),
    });
  } finally {
    await pool.end();
  }
}

export async function cloneDatabase(
  adminUrl: string,
  template: string,
  name: string,
): Promise<void> {
  await withAdmin(adminUrl, (c) => c.query(`create database "${name}" template "${template}"`));
}

export async function dropDatabase(adminUrl: string, name: string): Promise<void> {
  await withAdmin(adminUrl, (c) => c.query(`drop database if exists "${name}" with (force)`));
}

/** The name prefix of the test files' databases cloned from `template` (cw_tpl_… → cw_t_…_). */
export function fileDatabasePrefix(template: string): string {
  return `${template.replace(/^cw_tpl_/, 'cw_t_')}_`;
}

/** Drops the databases of this run's test files that are still there, side by side. */
export async function dropFileDatabases(adminUrl: string, template: string): Promise<void> {
  const prefix = fileDatabasePrefix(template);
  const { rows } = await withAdmin(adminUrl, (c) =>
    c.query<{ datname: string }>(
      'select datname from pg_database where starts_with(datname, $1) order by datname',
      [prefix],
    ),
  );
  await Promise.all(rows.map((r) => dropDatabase(adminUrl, r.datname)));
}
