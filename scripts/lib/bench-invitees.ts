/**
 * Invitations for the fault benchmark: the demo editor imports invitees into the bench study
 * through the API and sends their invitations (they go to the mail outbox); afterwards the
 * fake mail server's inbox says who got how many.
 */
import type { SendResult } from '../../shared/schemas/invitees';
import type { createJsonClient } from './json-client';
import { signInDemo } from './bench-demo-run';
import type { PrivateMail } from './fault-services';

export type DemoSession = { request: ReturnType<typeof createJsonClient>; teamId: string };

export async function signInDemoEditor(
  base: string,
  credentialsFile: string,
): Promise<DemoSession> {
  const { request, me } = await signInDemo(base, credentialsFile, 'editor');
  return { request, teamId: me.teams[0].id };
}

export async function inviteAll(session: DemoSession, studyId: string, n: number) {
  const addresses = Array.from({ length: n }, (_, i) => `invitee-${i + 1}@faults.example`);
  const form = new FormData();
  const csv = ['email', ...addresses].join('\n');
  form.append('file', new Blob([csv], { type: 'text/csv' }), 'invitees.csv');
  const base = `/teams/${session.teamId}/studies/${studyId}/invitees`;
  await session.request('POST', `${base}/import`, form);
  const sent = await session.request<SendResult>('POST', `${base}/send`, {});
  return { count: sent.sent + sent.queued + sent.failed, addresses };
}

/**
 * Waits until every address has mail (or `timeoutMs`), then a little longer so that a second
 * copy would show; lost = addresses without mail, doubled = addresses with more than one.
 */
export async function mailOutcome(mail: PrivateMail, addresses: string[], timeoutMs: number) {
  const deadline = Date.now() + timeoutMs;
  let counts = await mail.countByRecipient().catch(() => new Map<string, number>());
  while (addresses.some((a) => !counts.get(a)) && Date.now() < deadline) {
    await new Promise((r) => setTimeout(r, 2_000));
    counts = await mail.countByRecipient().catch(() => counts);
  }
  await new Promise((r) => setTimeout(r, 5_000));
  counts = await mail.countByRecipient().catch(() => counts);
  return {
    lost: addresses.filter((a) => !counts.get(a)).length,
    doubled: addresses.filter((a) => (counts.get(a) ?? 0) > 1).length,
  };
}
