/**
 * `npm run backup [-- --out DIR]`: a pg_dump custom-format file of DATABASE_URL, the uploads
 * of DATA_DIR/files as a tar archive, and a manifest (time, schema version, row counts), in
 * DIR (default DATA_DIR/backups). Prints the manifest's path and the row counts as JSON.
 */
import path from 'node:path';
import { parseArgs } from 'node:util';
import { loadEnv } from '../server/env';
import { backup } from './lib/backup';

const { values } = parseArgs({ options: { out: { type: 'string' } } });
const env = loadEnv();
const outDir = path.resolve(values.out ?? path.join(env.DATA_DIR, 'backups'));
const { manifestFile, manifest } = await backup({
  databaseUrl: env.DATABASE_URL,
  dataDir: env.DATA_DIR,
  outDir,
});
console.log(
  JSON.stringify({
    manifest: manifestFile,
    schema: manifest.schema,
    files: manifest.files?.count ?? 0,
    tables: manifest.tables,
  }),
);
