/**
 * What a benchmark that runs the server as deployed works in: a scratch database (never the
 * demo one) with a connection pool of the benchmark's own, and a temporary folder for files,
 * logs and credentials; `close` stops the server it started and removes all of it.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { createDb, type DbOptions } from '../../db/client';
import { adminUrl, createScratchDatabase } from './scratch-db';

export async function openBenchWorkspace(folderPrefix: string, poolOptions: DbOptions) {
  const scratch = await createScratchDatabase(adminUrl(), 'cw_bench');
  const work = fs.mkdtempSync(path.join(os.tmpdir(), `${folderPrefix}-`));
  const { db, pool } = createDb(scratch.url, poolOptions);
  // An error on an idle connection is not the benchmark's result: it must not end the run.
  pool.on('error', () => {});
  return {
    scratch,
    work,
    db,
    pool,
    async close(server: { stop(): Promise<unknown> } | null) {
      await server?.stop();
      await pool.end();
      await scratch.drop();
      fs.rmSync(work, { recursive: true, force: true });
    },
  };
}
