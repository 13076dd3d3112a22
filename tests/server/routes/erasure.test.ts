/**
 * Erasure of one respondent (POST …/erasure and …/erasure/preview): owners only; the
 * respondent's answers, earlier answers, taste profiles and invitation go, a tombstone keeps
 * everyone else's number, runs that used them are marked, the audit trail keeps the number and
 * reason without the address or external id — and a refused request changes nothing at all.
 */
import { beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { randomBytes } from 'node:crypto';
import { useTestApp } from '../../support/test-app';
import { seedTastesStudy } from './tastes-fixture';
import { answerFor, sendAnswer, startLiveSession } from './respond-fixtures';
import { answerRevisions, invitees, respondents } from '../../../db/schema/fieldwork';
import { runs } from '../../../db/schema/models';
import { mailOutbox } from '../../../db/schema/mail';
import { roles } from '../../../shared/permissions';

const t = useTestApp({}, { signIn: 'team' });
let seeded: Awaited<ReturnType<typeof seedTastesStudy>>;
let other: Awaited<ReturnType<typeof seedTastesStudy>>;

const EMAIL = 'Resident.Two@Example.test';

beforeAll(async () => {
  other = await seedTastesStudy(t.deps.db, t.team.teamId);
});

/** A fresh study per test: respondent 2 came through a personal link, 3 revised an answer. */
beforeEach(async () => {
  const db = t.deps.db;
  seeded = await seedTastesStudy(db, t.team.teamId);
  await db.update(runs).set({ status: 'cancelled' }).where(eq(runs.id, seeded.runningRunId));
  const [inv] = await db
    .insert(invitees)
    .values({
      studyId: seeded.studyId,
      email: EMAIL.toLowerCase(),
      name: 'Resident Two',
      externalId: 'INV-2',
      token: randomBytes(16).toString('hex'),
    })
    .returning({ id: invitees.id });
  await db
    .update(respondents)
    .set({ inviteeId: inv!.id })
    .where(eq(respondents.id, seeded.respondentIds[1]!));
  await db.insert(mailOutbox).values({
    teamId: t.team.teamId,
    studyId: seeded.studyId,
    inviteeId: inv!.id,
    kind: 'reminder',
    toAddress: EMAIL,
    subject: 'Reminder',
    textBody: 'Please answer',
  });
  const [answer] = (
    await db.execute<{ id: string }>(
      sql`select id from answers where respondent_id = ${seeded.respondentIds[2]} and screen_key = 'task:1'`,
    )
  ).rows;
  await db.insert(answerRevisions).values({
    answerId: answer!.id,
    respondentId: seeded.respondentIds[2]!,
    studyId: seeded.studyId,
    screenKey: 'task:1',
    clientId: 'earlier-1',
    taskNumber: 1,
    chosenAlternative: 1,
    answeredAt: new Date(Date.UTC(2026, 0, 1, 9, 30)),
    replacedAt: new Date(Date.UTC(2026, 0, 1, 9, 31)),
  });
});

const base = (studyId = seeded.studyId) => `/api/teams/${t.team.teamId}/studies/${studyId}/erasure`;
const owner = () => t.team.agents.owner;
const reason = 'Request DP-2026-014 received by post';

/** Every row an erasure could touch, across all studies, in a stable order. */
async function snapshot() {
  const rows = async (q: ReturnType<typeof sql>) => (await t.deps.db.execute(q)).rows;
  return {
    respondents: await rows(
      sql`select id, study_id, external_id, invitee_id, status, included, device, flags, block
          from respondents order by id`,
    ),
    answers: await rows(sql`select id, respondent_id, value from answers order by id`),
    revisions: await rows(sql`select id, respondent_id from answer_revisions order by id`),
    invitees: await rows(sql`select id, email, name, external_id from invitees order by id`),
    profiles: await rows(
      sql`select run_id, respondent_id, mean from taste_profiles order by run_id, respondent_id`,
    ),
    runs: await rows(sql`select id, status, erased_respondents from runs order by id`),
    tombstones: await rows(sql`select id, study_id from respondent_tombstones order by id`),
    mail: await rows(sql`select id, invitee_id from mail_outbox order by id`),
    blocks: await rows(sql`select version_id, filling from respondent_block_counts order by 1`),
    audit: await rows(sql`select id, action, details from audit_events
                          where action = 'respondent.erased' order by id`),
  };
}
type Snapshot = Awaited<ReturnType<typeof snapshot>>;

/** The request is refused with 409 and `code`, and no stored row changes. */
async function expectConflictChangingNothing(
  send: () => PromiseLike<{ status: number; body: { error: { code: string } } }>,
  code: string,
): Promise<void> {
  const before = await snapshot();
  const res = await send();
  expect(res.status).toBe(409);
  expect(res.body.error.code).toBe(code);
  expect(await snapshot()).toEqual(before);
}

/** The snapshot without the rows of one erased respondent (and their invitation). */
function without(s: Snapshot, respondentId: string, inviteeId: string | null = null): Snapshot {
  const notR = (r: Record<string, unknown>) => r.respondent_id !== respondentId;
  return {
    ...s,
    respondents: s.respondents.filter((r) => r.id !== respondentId),
    answers: s.answers.filter(notR),
    revisions: s.revisions.filter(notR),
    profiles: s.profiles.filter(notR),
    invitees: s.invitees.filter((r) => r.id !== inviteeId),
    mail: s.mail.filter((r) => r.invitee_id !== inviteeId),
  };
}

/** Respondent numbers as the taste-profile download states them. */
async function profileNumbers(studyId: string, runId: string) {
  const res = await owner().get(
    `/api/teams/${t.team.teamId}/studies/${studyId}/exports/taste-profiles.csv?runId=${runId}`,
  );
  expect(res.status).toBe(200);
  const lines = res.text
    .replace(/^\uFEFF/, '')
    .trim()
    .split(/\r?\n/);
  const header = lines[0]!.split(',');
  const number = header.indexOf('number');
  const respondent = header.indexOf('respondent');
  return new Map(
    lines.slice(1).map((l) => [l.split(',')[respondent]!, Number(l.split(',')[number])]),
  );
}

describe('POST …/erasure/preview', () => {
  it('finds a respondent by invitee address (any case) and changes nothing', async () => {
    const before = await snapshot();
    const res = await owner()
      .post(`${base()}/preview`)
      .send({ by: 'email', value: EMAIL.toUpperCase() });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      number: 2,
      reference: seeded.respondentIds[1]!.slice(0, 8),
      status: 'completed',
      answers: 5,
      revisions: 0,
      invitation: true,
      runsAffected: 1,
    });
    expect(await snapshot()).toEqual(before);
  });

  it('finds a respondent by external id and by number', async () => {
    const byId = await owner().post(`${base()}/preview`).send({ by: 'externalId', value: 'EXT-2' });
    expect(byId.body).toMatchObject({ number: 3, revisions: 1, invitation: false });
    const byNumber = await owner().post(`${base()}/preview`).send({ by: 'number', value: '3' });
    expect(byNumber.body).toEqual(byId.body);
  });
});

describe('POST …/erasure', () => {
  it('erases one respondent and nothing else; the others keep their numbers', async () => {
    const numbersBefore = await profileNumbers(seeded.studyId, seeded.runId);
    const otherBefore = await profileNumbers(other.studyId, other.runId);
    const before = await snapshot();
    const target = seeded.respondentIds[2]!;

    const res = await owner().post(base()).send({ by: 'number', value: '3', reason });

    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ number: 3, answers: 5, revisions: 1, runsAffected: 1 });
    const after = await snapshot();
    const expected = without(before, target);
    expect(after.respondents).toEqual(expected.respondents);
    expect(after.answers).toEqual(expected.answers);
    expect(after.revisions).toEqual(expected.revisions);
    expect(after.profiles).toEqual(expected.profiles);
    expect(after.invitees).toEqual(before.invitees);
    expect(after.mail).toEqual(before.mail);
    expect(after.tombstones).toEqual([
      ...before.tombstones,
      { id: target, study_id: seeded.studyId },
    ]);
    // Only the run that used the respondent is marked.
    expect(after.runs).toEqual(
      before.runs.map((r) =>
        r.id === seeded.runId ? { ...r, erased_respondents: Number(r.erased_respondents) + 1 } : r,
      ),
    );
    const numbersAfter = await profileNumbers(seeded.studyId, seeded.runId);
    expect(numbersAfter.size).toBe(numbersBefore.size - 1);
    for (const [id, n] of numbersAfter) expect(n).toBe(numbersBefore.get(id));
    // The other study of the team is untouched.
    expect(await profileNumbers(other.studyId, other.runId)).toEqual(otherBefore);
    expect(otherBefore.size).toBe(6);
  });

  it('records the erasure in the audit trail by number and reason, without the lookup value', async () => {
    await owner().post(base()).send({ by: 'externalId', value: 'EXT-2', reason });
    const { audit } = await snapshot();
    const last = audit[audit.length - 1]!;
    expect(last.details).toMatchObject({ number: 3, foundBy: 'externalId', reason, runsMarked: 1 });
    const [row] = (await t.deps.db.execute(sql`select * from audit_events where id = ${last.id}`))
      .rows;
    expect(JSON.stringify(row)).not.toContain('EXT-2');
    expect(row).toMatchObject({
      study_id: seeded.studyId,
      target_id: '3',
      actor_id: t.team.users.owner,
    });
  });

  it('found by address, deletes the invitation and its queued mail too', async () => {
    const before = await snapshot();
    const [inv] = await t.deps.db
      .select({ id: invitees.id })
      .from(invitees)
      .where(eq(invitees.studyId, seeded.studyId));
    const res = await owner().post(base()).send({ by: 'email', value: EMAIL, reason });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ number: 2, invitation: true });
    const after = await snapshot();
    const expected = without(before, seeded.respondentIds[1]!, inv!.id);
    expect(after.invitees).toEqual(expected.invitees);
    expect(after.mail).toEqual(expected.mail);
    expect(JSON.stringify(after.audit)).not.toMatch(/resident/i);
  });

  it('shows the run as having used an erased respondent, in the API and the results file', async () => {
    await owner().post(base()).send({ by: 'number', value: '1', reason });
    const run = await owner().get(
      `/api/teams/${t.team.teamId}/studies/${seeded.studyId}/runs/${seeded.runId}`,
    );
    expect(run.body.erasedRespondents).toBe(1);
    const report = await owner().get(
      `/api/teams/${t.team.teamId}/studies/${seeded.studyId}/exports/run-report.html?runId=${seeded.runId}`,
    );
    expect(report.status).toBe(200);
    expect(report.text).toContain('1 respondent was erased on request after this run');
  });
});

describe('refused requests change nothing', () => {
  const erase = { by: 'number', value: '2', reason };
  for (const role of roles.filter((r) => r !== 'owner'))
    it(`as ${role}: 403 for preview and erasure`, async () => {
      const before = await snapshot();
      const a = await t.team.agents[role].post(`${base()}/preview`).send(erase);
      const b = await t.team.agents[role].post(base()).send(erase);
      expect([a.status, b.status]).toEqual([403, 403]);
      expect(b.body.error.code).toBe('forbidden');
      expect(await snapshot()).toEqual(before);
    });

  it('as a member of another team: 404; anonymous: 401', async () => {
    const before = await snapshot();
    expect((await t.team.outsider.post(base()).send(erase)).status).toBe(404);
    expect((await t.request().post(base()).send(erase)).status).toBe(401);
    expect(await snapshot()).toEqual(before);
  });

  it.each([
    [{ by: 'number', value: 'two', reason }, 400, 'value'],
    [{ by: 'number', value: '0', reason }, 400, 'value'],
    [{ by: 'name', value: 'x', reason }, 400, 'by'],
    [{ by: 'number', value: '2' }, 400, 'reason'],
    [{ by: 'number', value: '2', reason: 'no' }, 400, 'reason'],
    [{ by: 'number', value: '99', reason }, 404, 'value'],
    [{ by: 'email', value: 'nobody@example.test', reason }, 404, 'value'],
    [{ by: 'externalId', value: 'INV-404', reason }, 404, 'value'],
  ])('%o: %i with the field named', async (body, status, field) => {
    const before = await snapshot();
    const res = await owner().post(base()).send(body);
    expect(res.status).toBe(status);
    expect(res.body.error.message).toEqual(expect.any(String));
    expect(res.body.error.fields.map((f: { path: string }) => f.path)).toContain(field);
    expect(await snapshot()).toEqual(before);
  });

  it('an already erased number: 409, and the second request changes nothing', async () => {
    expect((await owner().post(base()).send(erase)).status).toBe(200);
    await expectConflictChangingNothing(() => owner().post(base()).send(erase), 'already_erased');
  });

  it('two respondents with one external id: 409 asks for numbers', async () => {
    await t.deps.db
      .update(respondents)
      .set({ externalId: 'EXT-2' })
      .where(eq(respondents.id, seeded.respondentIds[4]!));
    await expectConflictChangingNothing(
      () => owner().post(base()).send({ by: 'externalId', value: 'EXT-2', reason }),
      'ambiguous_respondent',
    );
  });

  it('while a model of the study is being estimated: 409, nothing erased', async () => {
    await t.deps.db.update(runs).set({ status: 'running' }).where(eq(runs.id, seeded.runningRunId));
    await expectConflictChangingNothing(() => owner().post(base()).send(erase), 'run_in_progress');
  });

  it('a study of another team: 404', async () => {
    const outsiderTeam = await t.team.outsider.get('/api/teams');
    const foreignTeamId = outsiderTeam.body[0]?.id ?? outsiderTeam.body.teams?.[0]?.id;
    expect(foreignTeamId).toBeTruthy();
    const before = await snapshot();
    const res = await t.team.outsider
      .post(`/api/teams/${foreignTeamId}/studies/${seeded.studyId}/erasure`)
      .send(erase);
    expect(res.status).toBe(404);
    expect(await snapshot()).toEqual(before);
  });
});

describe('a respondent answering while being erased', () => {
  it('cannot store answers once erased, even with their session remembered by the server', async () => {
    const { study, session } = await startLiveSession(t, t.team.agents.owner, t.team.teamId);
    const answerScreen = (i: number) =>
      sendAnswer(
        t,
        study.publicId,
        session.sessionToken,
        'answers',
        answerFor(session.screens[i]!),
      );
    const first = await answerScreen(0);
    expect(first.status).toBeLessThan(300);
    const erased = await owner().post(base(study.id)).send({ by: 'number', value: '1', reason });
    expect(erased.status).toBe(200);
    const later = await answerScreen(1);
    expect(later.status).toBeGreaterThanOrEqual(400);
    expect(later.status).toBeLessThan(500);
    const { rows } = await t.deps.db.execute(
      sql`select count(*)::int as n from answers where study_id = ${study.id}`,
    );
    expect(rows[0]!.n).toBe(0);
  });
});
