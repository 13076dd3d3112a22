/**
 * Gives an API test file its own database, cloned from the run's migrated template
 * (tests/global-setup.ts), and drops it afterwards.
 */
import { randomBytes } from 'node:crypto';
import { createDb, type Db } from '../../db/client';
import { cloneDatabase, databaseUrl, dropDatabase, fileDatabasePrefix } from './template-db';

export type TestDb = { db: Db; url: string; close(): Promise<void> };

export async function createTestDb(): Promise<TestDb> {
  const adminUrl = process.env.CW_TEST_ADMIN_URL;
  const template = process.env.CW_TEST_TEMPLATE_DB;
  if (!adminUrl || !template) throw new Error('tests/global-setup.ts did not run');
  const name = `${fileDatabasePrefix(template)}${randomBytes(5).toString('hex')}`;
  await cloneDatabase(adminUrl, template, name);
  const url = databaseUrl(adminUrl, name);
  const { db, pool } = createDb(url, 5);
  // Dropping the database with (force) ends idle connections; that is expected here.
  pool.on('error', () => {});
  return {
    db,
    url,
    async close() {
      await pool.end();
      // Not waited for: DROP DATABASE waits for a checkpoint of the whole server (1–3 s on a
      // busy machine), and nothing uses this database again, so the next file starts meanwhile;
      // drops that overlap share their checkpoints. The run's teardown drops any left.
      dropDatabase(adminUrl, name).catch(() => {});
    },
  };
}
