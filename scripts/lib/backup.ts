/**
 * Backups and restores of everything Choicewright keeps: the PostgreSQL database (pg_dump's
 * custom format, from the Debian package) and the uploaded files under DATA_DIR/files (a tar
 * archive). A manifest beside the dump records when it was taken, the schema version (the last
 * applied migration) and the row count of every table, so a restore can prove it is complete.
 * A restore goes into an empty database in one transaction (all or nothing) and refuses a
 * database that holds tables unless forced.
 */
import { execFile } from 'node:child_process';
import { createHash } from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';
import { promisify } from 'node:util';
import pg from 'pg';

const run = promisify(execFile);
const journalFile = path.resolve(import.meta.dirname, '../../db/migrations/meta/_journal.json');

export type BackupManifest = {
  format: 'choicewright-backup/1';
  createdAt: string;
  /** The last applied migration (db/migrations) and how many are applied. */
  schema: { migration: string | null; applied: number };
  pgDump: string;
  dump: { file: string; sha256: string; bytes: number };
  /** Uploaded files, or null when there were none to keep. */
  files: { file: string; sha256: string; count: number } | null;
  /** Rows per table (schemas public and drizzle). */
  tables: Record<string, number>;
};

async function withClient<T>(url: string, fn: (c: pg.Client) => Promise<T>): Promise<T> {
  const c = new pg.Client({ connectionString: url });
  await c.connect();
  try {
    return await fn(c);
  } finally {
    await c.end();
  }
}

async function sha256(file: string): Promise<string> {
  return createHash('sha256')
    .update(await fs.readFile(file))
    .digest('hex');
}

/** Row counts of every table the app owns (its data and the applied migrations). */
export async function countRows(url: string): Promise<Record<string, number>> {
  return withClient(url, async (c) => {
    const { rows } = await c.query<{ schema: string; name: string }>(
      `select table_schema as schema, table_name as name from information_schema.tables
        where table_schema in ('public', 'drizzle') and table_type = 'BASE TABLE'
        order by 1, 2`,
    );
    const out: Record<string, number> = {};
    for (const t of rows) {
      const q = `select count(*)::int as n from "${t.schema}"."${t.name}"`;
      const key = t.schema === 'public' ? t.name : `${t.schema}.${t.name}`;
      out[key] = (await c.query<{ n: number }>(q)).rows[0]!.n;
    }
    return out;
  });
}

async function readJournal() {
  return JSON.parse(await fs.readFile(journalFile, 'utf8')) as {
    entries: { when: number; tag: string }[];
  };
}

async function schemaVersion(url: string): Promise<BackupManifest['schema']> {
  const journal = await readJournal();
  return withClient(url, async (c) => {
    const exists = await c.query(`select to_regclass('drizzle.__drizzle_migrations') as t`);
    if (!exists.rows[0]?.t) return { migration: null, applied: 0 };
    const { rows } = await c.query<{ n: number; last: string | null }>(
      `select count(*)::int as n, max(created_at)::text as last from drizzle.__drizzle_migrations`,
    );
    const last = rows[0]?.last ? Number(rows[0].last) : null;
    const tag = journal.entries.find((e) => e.when === last)?.tag ?? null;
    return { migration: tag, applied: rows[0]?.n ?? 0 };
  });
}

const stamp = (d: Date) =>
  d
    .toISOString()
    .replace(/[-:]/g, '')
    .replace(/\.\d+Z$/, 'Z');

/** Writes `<outDir>/choicewright-<time>.dump`, `.files.tar` (if any) and `.manifest.json`. */
export async function backup(opts: {
  databaseUrl: string;
  dataDir: string;
  outDir: string;
  now?: Date;
}): Promise<{ manifestFile: string; manifest: BackupManifest }> {
  const now = opts.now ?? new Date();
  await fs.mkdir(opts.outDir, { recursive: true });
  const base = path.join(opts.outDir, `choicewright-${stamp(now)}`);
  const dumpFile = `${base}.dump`;
  // Counted inside pg_dump's snapshot would be exact; counting just before is enough for a
  // drill on a quiet database, and the restore compares with the dump itself anyway.
  const tables = await countRows(opts.databaseUrl);
  await run('pg_dump', ['--format=custom', '--no-owner', `--file=${dumpFile}`, opts.databaseUrl]);
  const filesDir = path.join(opts.dataDir, 'files');
  const uploads = await fs.readdir(filesDir).catch(() => [] as string[]);
  let files: BackupManifest['files'] = null;
  if (uploads.length > 0) {
    const tarFile = `${base}.files.tar`;
    await run('tar', ['-cf', tarFile, '-C', opts.dataDir, 'files']);
    const count = uploads.filter((f) => !f.endsWith('.type')).length;
    files = { file: path.basename(tarFile), sha256: await sha256(tarFile), count };
  }
  const manifest: BackupManifest = {
    format: 'choicewright-backup/1',
    createdAt: now.toISOString(),
    schema: await schemaVersion(opts.databaseUrl),
    pgDump: (await run('pg_dump', ['--version'])).stdout.trim(),
    dump: {
      file: path.basename(dumpFile),
      sha256: await sha256(dumpFile),
      bytes: (await fs.stat(dumpFile)).size,
    },
    files,
    tables,
  };
  const manifestFile = `${base}.manifest.json`;
  await fs.writeFile(manifestFile, `${JSON.stringify(manifest, null, 2)}\n`);
  return { manifestFile, manifest };
}

export class RestoreRefused extends Error {
  override name = 'RestoreRefused';
}

async function tablesIn(url: string): Promise<number> {
  return withClient(url, async (c) => {
    const { rows } = await c.query<{ n: number }>(
      `select count(*)::int as n from information_schema.tables
        where table_schema not in ('pg_catalog', 'information_schema')`,
    );
    return rows[0]!.n;
  });
}

/** The manifest of a backup, given the manifest or the dump file. */
export async function readManifest(
  file: string,
): Promise<{ dir: string; manifest: BackupManifest }> {
  const manifestFile = file.endsWith('.manifest.json')
    ? file
    : file.replace(/\.dump$/, '') + '.manifest.json';
  const manifest = JSON.parse(await fs.readFile(manifestFile, 'utf8')) as BackupManifest;
  if (manifest.format !== 'choicewright-backup/1')
    throw new RestoreRefused(`${manifestFile} is not a Choicewright backup manifest`);
  return { dir: path.dirname(manifestFile), manifest };
}

/**
 * Restores a backup into `databaseUrl` and the uploads into `dataDir/files`, then checks every
 * table's row count against the manifest. Refuses (changing nothing) a damaged backup, a
 * database that already holds tables, or an uploads folder that already holds files — unless
 * `force`, which replaces what is there.
 */
export async function restore(opts: {
  file: string;
  databaseUrl: string;
  dataDir: string;
  force?: boolean;
}): Promise<{ manifest: BackupManifest; tables: Record<string, number> }> {
  const { dir, manifest } = await readManifest(opts.file);
  // A newer version's schema would meet code that does not know it: update the app first.
  const known = (await readJournal()).entries.map((e) => e.tag);
  if (manifest.schema.migration && !known.includes(manifest.schema.migration))
    throw new RestoreRefused(
      `The backup's schema (${manifest.schema.migration}) is newer than this version of Choicewright knows; update it before restoring.`,
    );
  const dumpFile = path.join(dir, manifest.dump.file);
  if ((await sha256(dumpFile)) !== manifest.dump.sha256)
    throw new RestoreRefused(`${dumpFile} does not match its manifest (damaged or replaced)`);
  const tarFile = manifest.files ? path.join(dir, manifest.files.file) : null;
  if (tarFile && (await sha256(tarFile)) !== manifest.files!.sha256)
    throw new RestoreRefused(`${tarFile} does not match its manifest (damaged or replaced)`);
  if (!opts.force && (await tablesIn(opts.databaseUrl)) > 0)
    throw new RestoreRefused(
      'The target database is not empty. Restore into a new database, or pass --force to replace its contents.',
    );
  const filesDir = path.join(opts.dataDir, 'files');
  const existing = await fs.readdir(filesDir).catch(() => [] as string[]);
  if (tarFile && !opts.force && existing.length > 0)
    throw new RestoreRefused(
      `${filesDir} already holds files. Restore into an empty data folder, or pass --force.`,
    );
  await run('pg_restore', [
    '--no-owner',
    '--exit-on-error',
    '--single-transaction',
    ...(opts.force ? ['--clean', '--if-exists'] : []),
    `--dbname=${opts.databaseUrl}`,
    dumpFile,
  ]);
  if (tarFile) {
    if (opts.force) await fs.rm(filesDir, { recursive: true, force: true });
    await fs.mkdir(opts.dataDir, { recursive: true });
    await run('tar', ['-xf', tarFile, '-C', opts.dataDir]);
  }
  const tables = await countRows(opts.databaseUrl);
  const differ = Object.keys({ ...manifest.tables, ...tables }).filter(
    (k) => manifest.tables[k] !== tables[k],
  );
  if (differ.length > 0)
    throw new Error(
      `Restored row counts differ from the manifest: ${differ.map((k) => `${k} ${tables[k] ?? 'missing'} ≠ ${manifest.tables[k] ?? 'missing'}`).join(', ')}`,
    );
  return { manifest, tables };
}
