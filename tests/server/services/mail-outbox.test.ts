/**
 * Mail that is never lost or doubled: invitations go through the outbox. A mail server that is
 * down delays them (queued with the reason, retried by the job with backoff, sent once it is
 * back); a refusal fails them with the reason and the invitee can be invited again; a process
 * that died mid-send leaves a row that is failed as "may have been delivered", never sent
 * twice; the retry job is enqueued in the same transaction as the row's state.
 */
import { beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { uniqueEmail } from '../../support/factories';
import { insertStudy } from '../routes/fieldwork-fixtures';
import { invitees } from '../../../db/schema/fieldwork';
import { mailOutbox } from '../../../db/schema/mail';
import type { Mailer, OutgoingMail } from '../../../server/mail/mailer';
import { createMailJobKind, INTERRUPTED_SEND_MS } from '../../../server/jobs/mail-job';
import {
  deliverOutboxMail,
  MAIL_JOB,
  MAX_MAIL_ATTEMPTS,
  retryDelaySeconds,
} from '../../../server/services/mail-delivery';

// Sends only: the tests run the job's handler themselves, so every attempt is theirs.
const t = useTestApp({}, { signIn: 'team', jobQueue: { work: false } });
const delivered: OutgoingMail[] = [];
let failure: Error | null = null;

/** A mail server we can take down: `failure` is thrown instead of delivering. */
const flakyMailer: Mailer = {
  async send(mail) {
    if (failure) throw failure;
    delivered.push(mail);
  },
  close() {},
};
const unreachable = () => Object.assign(new Error('connect ECONNREFUSED'), { code: 'ESOCKET' });
const refused = () =>
  Object.assign(new Error('Mailbox unavailable'), {
    responseCode: 550,
    response: '550 5.1.1 Mailbox unavailable',
  });

beforeAll(() => {
  t.deps.mailer = flakyMailer;
});
beforeEach(() => {
  delivered.length = 0;
  failure = null;
});

async function studyWithInvitee() {
  const study = await insertStudy(t.deps.db, { teamId: t.team.teamId });
  const email = uniqueEmail('inv');
  const [inv] = await t.deps.db
    .insert(invitees)
    .values({ studyId: study.studyId, email, token: `tok-${email}` })
    .returning({ id: invitees.id });
  const invite = () =>
    t.team.agents.editor
      .post(`/api/teams/${t.team.teamId}/studies/${study.studyId}/invitees/send`)
      .send({})
      .expect(200);
  const row = async () => {
    const [r] = await t.deps.db.select().from(mailOutbox).where(eq(mailOutbox.inviteeId, inv.id));
    return r;
  };
  const listed = async () =>
    (
      await t.team.agents.editor
        .get(`/api/teams/${t.team.teamId}/studies/${study.studyId}/invitees`)
        .expect(200)
    ).body.items[0];
  return { study, email, inviteeId: inv.id, invite, row, listed };
}

/** An invitation whose first send met an unreachable mail server, so it sits in the outbox. */
async function queuedAfterUnreachableServer() {
  const s = await studyWithInvitee();
  failure = unreachable();
  await s.invite();
  const { id } = await s.row();
  return { s, id };
}

describe('invitations through the mail outbox', () => {
  it('a healthy mail server gets the invitation at once, exactly once', async () => {
    const s = await studyWithInvitee();
    expect((await s.invite()).body).toEqual({ sent: 1, queued: 0, failed: 0, skipped: 0 });
    expect(delivered.map((m) => m.to)).toEqual([s.email]);
    expect(await s.row()).toMatchObject({ status: 'sent', attempts: 1, lastError: null });
    expect((await s.listed()).mail).toEqual({ kind: 'invitation', status: 'sent', reason: null });
    // The safety-net job finds the row sent and sends nothing.
    expect(await deliverOutboxMail(t.deps, (await s.row()).id, { scheduleRetry: true })).toBe(
      'skipped',
    );
    expect(delivered).toHaveLength(1);
  });

  it('a mail server that is down delays the invitation; the job sends it once it is back', async () => {
    const s = await studyWithInvitee();
    failure = unreachable();
    expect((await s.invite()).body).toEqual({ sent: 0, queued: 1, failed: 0, skipped: 0 });
    const queued = await s.row();
    expect(queued).toMatchObject({ status: 'queued', attempts: 1 });
    expect((await s.listed()).mail).toEqual({
      kind: 'invitation',
      status: 'queued',
      reason: 'The mail server could not be reached (ESOCKET)',
    });
    // Its job was enqueued with the row, in the same transaction.
    expect((await t.queue.pendingIds(MAIL_JOB, 'outboxId')).has(queued.id)).toBe(true);

    // Still down when the job runs: queued again, with the next job scheduled.
    const handle = createMailJobKind().handle;
    await handle({ outboxId: queued.id }, { deps: t.deps, jobId: 'j1' });
    expect(await s.row()).toMatchObject({ status: 'queued', attempts: 2 });

    failure = null;
    await handle({ outboxId: queued.id }, { deps: t.deps, jobId: 'j2' });
    expect(await s.row()).toMatchObject({ status: 'sent', attempts: 3, lastError: null });
    expect(delivered.map((m) => m.to)).toEqual([s.email]);
  });

  it('a refusal fails the invitation with the reason, and the invitee can be invited again', async () => {
    const s = await studyWithInvitee();
    failure = refused();
    expect((await s.invite()).body).toEqual({ sent: 0, queued: 0, failed: 1, skipped: 0 });
    expect((await s.listed()).mail).toEqual({
      kind: 'invitation',
      status: 'failed',
      reason: 'The mail server refused the message (550: 550 5.1.1 Mailbox unavailable)',
    });
    expect((await s.listed()).state).toBe('not_sent');
    failure = null;
    expect((await s.invite()).body.sent).toBe(1);
    expect(delivered).toHaveLength(1);
  });

  it('gives up after the last attempt, saying so', async () => {
    const { s, id } = await queuedAfterUnreachableServer();
    await t.deps.db
      .update(mailOutbox)
      .set({ attempts: MAX_MAIL_ATTEMPTS - 1 })
      .where(eq(mailOutbox.id, id));
    expect(await deliverOutboxMail(t.deps, id, { scheduleRetry: true })).toBe('failed');
    expect((await s.row()).lastError).toMatch(/gave up after 10 attempts/);
  });

  it('a send interrupted by a crash is failed as possibly delivered and never sent again', async () => {
    const { s, id } = await queuedAfterUnreachableServer();
    // A worker claimed it and died while talking to the mail server.
    await t.deps.db
      .update(mailOutbox)
      .set({ status: 'sending', sendingAt: new Date(Date.now() - INTERRUPTED_SEND_MS - 60_000) })
      .where(eq(mailOutbox.id, id));
    failure = null;
    await createMailJobKind().sweep!(t.deps, t.queue);
    expect(await s.row()).toMatchObject({ status: 'failed' });
    expect((await s.row()).lastError).toMatch(/may have been delivered/);
    expect(await deliverOutboxMail(t.deps, id, { scheduleRetry: true })).toBe('skipped');
    expect(delivered).toHaveLength(0);
  });

  it('retries back off: 30 s, doubling, at most 30 minutes apart', () => {
    expect([1, 2, 3, 4, 7, 10].map(retryDelaySeconds)).toEqual([30, 60, 120, 240, 1800, 1800]);
  });
});
