/**
 * The restore drill: a team with a study, respondents, a finished run, taste profiles, an
 * uploaded image and an audit trail is backed up (scripts/lib/backup.ts: pg_dump custom format
 * + uploads + manifest), restored into a new empty database and data folder, and the app on the
 * restored copy must serve the same row counts, the same downloads of one study and the same
 * image bytes. A non-empty target is refused and left as it was; --force replaces it.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type supertest from 'supertest';
import { sql } from 'drizzle-orm';
import { createTestApp, useTestApp } from '../support/test-app';
import { TEST_PASSWORD } from '../support/factories';
import { createScratchDatabase } from '../../scripts/lib/scratch-db';
import { databaseFingerprint } from '../support/db-fingerprint';
import { seedTastesStudy } from '../server/routes/tastes-fixture';
import { createStudyVia } from '../server/routes/study-fixtures';
import { createDb } from '../../db/client';
import { backup, countRows, restore, RestoreRefused } from '../../scripts/lib/backup';

// PNG signature + IHDR of a 1×1 image (ISO/IEC 15948 §5.2, §11.2.2).
const png = Buffer.concat([
  Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
  Buffer.from('0000000d49484452000000010000000108060000001f15c489', 'hex'),
]);

const tmp = (prefix: string) => fs.mkdtempSync(path.join(os.tmpdir(), prefix));
const adminUrl = () => process.env.CW_TEST_ADMIN_URL!;

const t = useTestApp({}, { signIn: 'team', dataDir: true });
let seeded: Awaited<ReturnType<typeof seedTastesStudy>>;
let outDir: string;
let imageUrl: string;
const made: (() => Promise<void>)[] = [];

async function emptyDatabase(): Promise<string> {
  const scratch = await createScratchDatabase(adminUrl(), 'cw_restore');
  made.push(scratch.drop);
  return scratch.url;
}

/** The app on another database and data folder, with the owner signed in. */
async function appOn(url: string, dir: string) {
  // The same secret as the backed-up app's: the restored sessions and links stay valid.
  const app = await createTestApp({ DATA_DIR: dir }, { databaseUrl: url });
  const email = (
    await app.testDb.db.execute<{ email: string }>(
      sql`select u.email from users u join memberships m on m.user_id = u.id
           where m.team_id = ${t.team.teamId} and m.role = 'owner'`,
    )
  ).rows[0]!.email;
  const agent = app.request();
  await agent.post('/api/auth/sign-in').send({ email, password: TEST_PASSWORD }).expect(200);
  return { agent, db: app.testDb.db, close: app.close };
}

/** One study's downloads, as the owner gets them. */
async function downloads(agent: supertest.Agent) {
  const base = `/api/teams/${t.team.teamId}/studies/${seeded.studyId}/exports`;
  const get = async (p: string) => {
    const res = await agent.get(`${base}/${p}`);
    expect(res.status, p).toBe(200);
    return res.text;
  };
  return {
    profiles: await get(`taste-profiles.csv?runId=${seeded.runId}`),
    answers: await get('background-answers.csv'),
    choices: await get(`choices.csv?runId=${seeded.runId}`),
  };
}

beforeAll(async () => {
  outDir = tmp('cw-backup-out-');
  seeded = await seedTastesStudy(t.deps.db, t.team.teamId);
  const draft = await createStudyVia(t.team.agents.owner, t.team.teamId);
  const up = await t.team.agents.owner
    .post(`/api/teams/${t.team.teamId}/studies/${draft.id}/files`)
    .attach('file', png, 'river.png')
    .expect(201);
  imageUrl = up.body.url;
});
afterAll(async () => {
  for (const drop of made) await drop();
  fs.rmSync(outDir, { recursive: true, force: true });
});

describe('backup and restore drill', () => {
  let manifestFile: string;

  it('writes a custom-format dump, the uploads and a manifest with the row counts', async () => {
    const result = await backup({ databaseUrl: t.testDb.url, dataDir: t.dataDir, outDir });
    manifestFile = result.manifestFile;
    const m = result.manifest;
    expect(fs.readFileSync(path.join(outDir, m.dump.file)).subarray(0, 5).toString()).toBe('PGDMP');
    expect(m.schema.migration).toMatch(/^\d{4}_/);
    expect(m.schema.applied).toBeGreaterThan(10);
    expect(m.files?.count).toBe(1);
    expect(m.tables).toEqual(await countRows(t.testDb.url));
    expect(m.tables.respondents).toBe(6);
    expect(m.tables.taste_profiles).toBe(6);
    expect(m.tables.stored_files).toBe(1);
  });

  it('restores into an empty database: same row counts, downloads and image', async () => {
    const url = await emptyDatabase();
    const dir = tmp('cw-restored-');
    const { tables } = await restore({ file: manifestFile, databaseUrl: url, dataDir: dir });
    // Nothing has changed in the original since the backup: its counts are the manifest's.
    expect(tables).toEqual(await countRows(t.testDb.url));

    const restored = await appOn(url, dir);
    try {
      expect(await downloads(restored.agent)).toEqual(await downloads(t.team.agents.owner));
      const image = await restored.agent.get(imageUrl).buffer(true);
      expect(image.status).toBe(200);
      expect(Buffer.compare(image.body as Buffer, png)).toBe(0);
    } finally {
      await restored.close();
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });

  it('refuses a database that holds tables, changing nothing; --force replaces it', async () => {
    const url = await emptyDatabase();
    const dir = tmp('cw-restored-');
    await restore({ file: manifestFile, databaseUrl: url, dataDir: dir });
    const { db, pool } = createDb(url, 2);
    try {
      await pool.query(`update teams set name = 'Renamed after the restore'`);
      const before = await databaseFingerprint(db);
      await expect(restore({ file: manifestFile, databaseUrl: url, dataDir: dir })).rejects.toThrow(
        RestoreRefused,
      );
      expect(await databaseFingerprint(db)).toEqual(before);
      const forced = await restore({
        file: manifestFile,
        databaseUrl: url,
        dataDir: dir,
        force: true,
      });
      expect(forced.tables).toEqual(forced.manifest.tables);
      expect(await databaseFingerprint(db)).not.toEqual(before);
    } finally {
      await pool.end();
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });

  /** Restores through a copy of the manifest changed by `patch`, into an empty database. */
  async function restoreAltered(name: string, patch: (m: Record<string, unknown>) => object) {
    const url = await emptyDatabase();
    const copy = path.join(outDir, `${name}.manifest.json`);
    fs.writeFileSync(
      copy,
      JSON.stringify(patch(JSON.parse(fs.readFileSync(manifestFile, 'utf8')))),
    );
    const attempt = restore({ file: copy, databaseUrl: url, dataDir: tmp('cw-x-') });
    return { url, attempt };
  }

  it('refuses a backup made by a newer version (unknown schema), changing nothing', async () => {
    const { url, attempt } = await restoreAltered('future', (m) => ({
      ...m,
      schema: { migration: '9999_future', applied: 99 },
    }));
    await expect(attempt).rejects.toThrow(/newer than this version/);
    expect(await countRows(url)).toEqual({});
  });

  it('refuses a dump that does not match its manifest, changing nothing', async () => {
    const { url, attempt } = await restoreAltered('tampered', (m) => ({
      ...m,
      dump: { ...(m.dump as object), sha256: '0'.repeat(64) },
    }));
    await expect(attempt).rejects.toThrow(/does not match its manifest/);
    expect(await countRows(url)).toEqual({});
  });
});
