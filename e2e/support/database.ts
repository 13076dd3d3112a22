/** The database the end-to-end server runs on, for journeys that check what was stored. */
import { execFileSync } from 'node:child_process';
import path from 'node:path';

export function e2eDatabaseUrl(): string {
  if (process.env.E2E_DATABASE_URL) return process.env.E2E_DATABASE_URL;
  const root = path.resolve(import.meta.dirname, '../..');
  return execFileSync(path.join(root, 'scripts/pg.sh'), ['url', 'choicewright_e2e'])
    .toString()
    .trim();
}
