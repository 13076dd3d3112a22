/**
 * One person, one respondent: a personal link opened on several devices at once, and a panel
 * id that comes back, each yield one respondent (unique indexes decide the race, the loser
 * resumes the winner's session); a study that keeps duplicate panel ids gets one respondent
 * per visit; the block counter counts each person once.
 */
import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { respondentBlockCounts, respondents } from '../../../db/schema/fieldwork';
import { insertInvitee, insertStudy } from './respond-fixtures';
import { startedRespondentBatcherOf } from '../../../server/services/respondent-session';

const t = useTestApp({}, { signIn: 'owner' });

async function liveStudy(settings: object = {}) {
  const study = await insertStudy(t, t.teamId, { settings });
  await t.owner.post(`/api/teams/${t.teamId}/studies/${study.id}/lifecycle/go-live`).expect(200);
  return study;
}

const start = (publicId: string, params: Record<string, string>) =>
  t.request().post(`/api/r/${publicId}/sessions`).send({ params, device: 'phone' });

async function respondentsOf(studyId: string) {
  return t.deps.db.select().from(respondents).where(eq(respondents.studyId, studyId));
}

async function placesTaken(studyId: string) {
  const rows = await respondentsOf(studyId);
  const [counter] = await t.deps.db
    .select()
    .from(respondentBlockCounts)
    .where(eq(respondentBlockCounts.versionId, rows[0].versionId));
  return counter.filling.reduce((a, b) => a + b, 0);
}

describe('one person, one respondent', () => {
  it('a personal link opened on eight devices at once gives one respondent and one session', async () => {
    const s = await liveStudy();
    const inv = await insertInvitee(t, s.id, 'HH-12');
    const sessions = await Promise.all(
      Array.from({ length: 8 }, () => start(s.publicId, { inv: inv.token })),
    );
    for (const r of sessions) expect(r.status).toBe(201);
    expect(new Set(sessions.map((r) => r.body.sessionToken)).size).toBe(1);
    const rows = await respondentsOf(s.id);
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ inviteeId: inv.id, externalId: 'HH-12' });
    // The losing starts gave their block places back.
    expect(await placesTaken(s.id)).toBe(1);
    // The database itself refuses a second respondent for the invitee.
    const { id: _id, sessionToken: _token, ...copy } = rows[0];
    await expect(
      t.deps.db.insert(respondents).values({ ...copy, sessionToken: 'another-device-token' }),
    ).rejects.toThrow();
  });

  it('a returning panel id resumes its own session, also when it arrives twice at once', async () => {
    const s = await liveStudy();
    const first = (await start(s.publicId, { pid: 'P-1' }).expect(201)).body;
    const again = (await start(s.publicId, { pid: 'P-1' }).expect(201)).body;
    expect(again.sessionToken).toBe(first.sessionToken);
    const racing = await Promise.all(
      Array.from({ length: 6 }, () => start(s.publicId, { pid: 'P-2' })),
    );
    expect(new Set(racing.map((r) => r.body.sessionToken)).size).toBe(1);
    const other = (await start(s.publicId, { pid: 'P-3' }).expect(201)).body;
    expect(other.sessionToken).not.toBe(first.sessionToken);
    const rows = await respondentsOf(s.id);
    expect(rows.map((r) => r.externalId).sort()).toEqual(['P-1', 'P-2', 'P-3']);
    expect(await placesTaken(s.id)).toBe(3);
  });

  it('a panel id arriving four times among twenty other starts at once: one respondent for it, the others unharmed', async () => {
    const s = await liveStudy();
    const batcher = startedRespondentBatcherOf(t.deps.db);
    const gatheredBefore = batcher.gathered;
    const pids = [
      ...Array.from({ length: 20 }, (_, i) => `Q-${i}`),
      ...Array.from({ length: 4 }, () => 'Q-twice'),
    ];
    const sessions = await Promise.all(pids.map((pid) => start(s.publicId, { pid })));
    for (const r of sessions) expect(r.status).toBe(201);
    // Most starts waited for the two inserts in flight and went in one statement; one with
    // a repeated panel id makes that statement fail, and each of its rows went again alone.
    expect(batcher.gathered).toBeGreaterThan(gatheredBefore);
    const repeated = sessions.slice(20).map((r) => r.body.sessionToken);
    expect(new Set(repeated).size).toBe(1);
    const rows = await respondentsOf(s.id);
    expect(rows.map((r) => r.externalId).sort()).toEqual([...new Set(pids)].sort());
    expect(await placesTaken(s.id)).toBe(21);
  });

  it('a panel id is de-duplicated per study, not across studies', async () => {
    const a = await liveStudy();
    const b = await liveStudy();
    const inA = (await start(a.publicId, { pid: 'P-9' }).expect(201)).body;
    const inB = (await start(b.publicId, { pid: 'P-9' }).expect(201)).body;
    expect(inB.sessionToken).not.toBe(inA.sessionToken);
  });

  it('with de-duplication switched off, every visit with the same panel id is a new respondent', async () => {
    const s = await liveStudy({ dedupePanelIds: false });
    const one = (await start(s.publicId, { pid: 'P-5' }).expect(201)).body;
    const two = (await start(s.publicId, { pid: 'P-5' }).expect(201)).body;
    expect(two.sessionToken).not.toBe(one.sessionToken);
    const rows = await respondentsOf(s.id);
    expect(rows.map((r) => [r.externalId, r.panelKey])).toEqual([
      ['P-5', null],
      ['P-5', null],
    ]);
  });

  it('a visit without a panel id is always a new respondent', async () => {
    const s = await liveStudy();
    const one = (await start(s.publicId, {}).expect(201)).body;
    const two = (await start(s.publicId, {}).expect(201)).body;
    expect(two.sessionToken).not.toBe(one.sessionToken);
  });
});
