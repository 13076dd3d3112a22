/**
 * Oversized bodies: the respondent API refuses anything over its limit with 413 and a clear
 * message, before parsing, and stores nothing; an answer of the largest allowed size passes.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { answers, respondents } from '../../../db/schema/fieldwork';
import { answerFor, insertStudy } from './respond-fixtures';

const t = useTestApp({}, { signIn: 'owner' });
let publicId: string;
let studyId: string;
beforeAll(async () => {
  const study = await insertStudy(t, t.teamId);
  ({ publicId, id: studyId } = study);
  await t.owner.post(`/api/teams/${t.teamId}/studies/${study.id}/lifecycle/go-live`).expect(200);
});

describe('respondent API body limit', () => {
  it('refuses an oversized session start with 413 too_large and creates no respondent', async () => {
    const params = { pid: 'P-1', padding: 'x'.repeat(40_000) };
    const res = await t.request().post(`/api/r/${publicId}/sessions`).send({ params }).expect(413);
    expect(res.body.error).toEqual({
      code: 'too_large',
      message: 'The request body is too large (at most 32 kB).',
    });
    expect(
      await t.deps.db.select().from(respondents).where(eq(respondents.studyId, studyId)),
    ).toHaveLength(0);
  });

  it('refuses an oversized answer with 413 and stores nothing; the session goes on', async () => {
    const session = (await t.request().post(`/api/r/${publicId}/sessions`).send({}).expect(201))
      .body;
    const send = (body: object) =>
      t
        .request()
        .post(`/api/r/${publicId}/answers`)
        .set('x-respondent-token', session.sessionToken)
        .send(body);
    const first = answerFor(session.screens[0]);
    const res = await send({ ...first, junk: 'y'.repeat(64_000) }).expect(413);
    expect(res.body.error.code).toBe('too_large');
    expect(await t.deps.db.select().from(answers).where(eq(answers.studyId, studyId))).toHaveLength(
      0,
    );
    // The longest text an answer may carry, fully escaped, is well inside the limit.
    const escaped = JSON.stringify({ ...first, note: '\u0001'.repeat(2000) });
    expect(Buffer.byteLength(escaped)).toBeLessThan(32 * 1024);
    await send(first).expect(201);
  });
});
