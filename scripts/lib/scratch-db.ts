/**
 * Throwaway databases for benchmarks, in the PostgreSQL that DATABASE_URL names (or the
 * project's own cluster): created empty, dropped at the end, never the demo database.
 */
import { execFileSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import path from 'node:path';
import pg from 'pg';
import { databaseUrl, dropDatabase } from '../../tests/support/template-db';

const root = path.resolve(import.meta.dirname, '../..');

/** The administrative URL (database `postgres`) of the server benchmarks use. */
export function adminUrl(): string {
  if (process.env.DATABASE_URL) return process.env.DATABASE_URL;
  execFileSync(path.join(root, 'scripts/pg.sh'), ['start'], {
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  return execFileSync(path.join(root, 'scripts/pg.sh'), ['url', 'postgres']).toString().trim();
}

export async function createScratchDatabase(
  admin: string,
  prefix: string,
): Promise<{ url: string; name: string; drop(): Promise<void> }> {
  const name = `${prefix}_${randomBytes(4).toString('hex')}`;
  const c = new pg.Client({ connectionString: admin });
  await c.connect();
  try {
    await c.query(`create database "${name}"`);
  } finally {
    await c.end();
  }
  return { url: databaseUrl(admin, name), name, drop: () => dropDatabase(admin, name) };
}
