import { beforeAll, describe, expect, it } from 'vitest';
import fs from 'node:fs';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { createStudyVia } from './study-fixtures';
import { storedFiles, studies } from '../../../db/schema/studies';
import type { Role } from '../../../shared/permissions';

const t = useTestApp({}, { signIn: 'team', dataDir: true });
let studyId: string;

// Smallest valid headers of each format (PNG: ISO/IEC 15948 signature + IHDR; JPEG: SOI + APP0).
const png = Buffer.concat([
  Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
  Buffer.from('0000000d49484452000000010000000108060000001f15c489', 'hex'),
]);
const jpeg = Buffer.from('ffd8ffe000104a46494600010100000100010000ffd9', 'hex');
const webp = Buffer.concat([Buffer.from('RIFF'), Buffer.alloc(4), Buffer.from('WEBPVP8 ')]);
const svg = Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>');

beforeAll(async () => {
  studyId = (await createStudyVia(t.team.agents.owner, t.team.teamId)).id;
});

const uploadUrl = () => `/api/teams/${t.team.teamId}/studies/${studyId}/files`;
const countFiles = async () => (await t.deps.db.select().from(storedFiles)).length;

describe('POST /api/teams/:teamId/studies/:studyId/files', () => {
  it.each<[string, Buffer, string]>([
    ['PNG', png, 'image/png'],
    ['JPEG', jpeg, 'image/jpeg'],
    ['WebP', webp, 'image/webp'],
  ])('stores a %s image and serves it publicly by its key', async (_n, bytes, type) => {
    const res = await t.team.agents.editor
      .post(uploadUrl())
      .attach('file', bytes, 'level.bin')
      .expect(201);
    expect(res.body).toMatchObject({ contentType: type, sizeBytes: bytes.length });
    expect(res.body.key).toMatch(/^[A-Za-z0-9_-]{24}\.[a-z]+$/);
    const served = await t.request().get(res.body.url).buffer(true).expect(200);
    expect(served.headers['content-type']).toBe(type);
    expect(Buffer.compare(served.body as Buffer, bytes)).toBe(0);
    expect(fs.existsSync(path.join(t.dataDir, 'files', res.body.key))).toBe(true);
  });

  it('when an SVG is named .png, returns 400 unsupported_type and stores nothing', async () => {
    const before = await countFiles();
    const res = await t.team.agents.owner
      .post(uploadUrl())
      .attach('file', svg, { filename: 'river.png', contentType: 'image/png' })
      .expect(400);
    expect(res.body.error).toMatchObject({ code: 'unsupported_type', fields: [{ path: 'file' }] });
    expect(await countFiles()).toBe(before);
  });

  it('when the image is over 2 MB, returns 413 with the field and stores nothing', async () => {
    const before = await countFiles();
    const big = Buffer.concat([png, Buffer.alloc(2 * 1024 * 1024)]);
    const res = await t.team.agents.owner
      .post(uploadUrl())
      .attach('file', big, 'big.png')
      .expect(413);
    expect(res.body.error).toMatchObject({ code: 'file_too_large', fields: [{ path: 'file' }] });
    expect(await countFiles()).toBe(before);
  });

  it.each<Role>(['analyst', 'viewer'])('as %s, returns 403', async (role) => {
    await t.team.agents[role].post(uploadUrl()).attach('file', png, 'a.png').expect(403);
  });

  it('for someone outside the team, returns 404', async () => {
    await t.team.outsider.post(uploadUrl()).attach('file', png, 'a.png').expect(404);
  });

  it('when the study is live, returns 409', async () => {
    const live = await createStudyVia(t.team.agents.owner, t.team.teamId);
    await t.deps.db.update(studies).set({ status: 'live' }).where(eq(studies.id, live.id));
    await t.team.agents.owner
      .post(`/api/teams/${t.team.teamId}/studies/${live.id}/files`)
      .attach('file', png, 'a.png')
      .expect(409);
  });
});

describe('GET /api/files/:key', () => {
  it('returns 404 for an unknown or malformed key', async () => {
    await t.request().get('/api/files/AAAAAAAAAAAAAAAAAAAAAAAA.png').expect(404);
    await t.request().get('/api/files/..%2F..%2Fjwt-secret').expect(404);
  });
});
