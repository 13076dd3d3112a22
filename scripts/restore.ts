/**
 * `npm run restore -- FILE [--force]`: restores a backup (its .dump or .manifest.json) into
 * DATABASE_URL and its uploads into DATA_DIR/files, in one transaction, then checks every
 * table's row count against the manifest. Refuses a non-empty database or uploads folder
 * unless --force (which replaces their contents). Exit code 2 on a refusal.
 */
import { parseArgs } from 'node:util';
import { loadEnv } from '../server/env';
import { restore, RestoreRefused } from './lib/backup';

const { values, positionals } = parseArgs({
  options: { force: { type: 'boolean', default: false } },
  allowPositionals: true,
});
if (positionals.length !== 1) {
  console.error('Usage: npm run restore -- FILE [--force]   (FILE: the .dump or .manifest.json)');
  process.exit(2);
}
const env = loadEnv();
try {
  const { manifest, tables } = await restore({
    file: positionals[0]!,
    databaseUrl: env.DATABASE_URL,
    dataDir: env.DATA_DIR,
    force: values.force,
  });
  console.log(JSON.stringify({ restored: manifest.createdAt, schema: manifest.schema, tables }));
} catch (err) {
  if (!(err instanceof RestoreRefused)) throw err;
  console.error(`Restore refused: ${err.message}`);
  process.exit(2);
}
