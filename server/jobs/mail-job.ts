/**
 * The mail job: sends one outbox row (server/services/mail-delivery.ts). Its sweep fails rows
 * a dead process left mid-send (they may have been delivered: never sent twice) and queues
 * again rows whose queue message was lost (mail is delayed, never dropped).
 */
import { z } from 'zod';
import { defineJobKind } from './queue';
import { sweepOrphans, type OrphanSpec } from './orphan-sweep';
import { deliverOutboxMail, MAIL_JOB } from '../services/mail-delivery';
import {
  failInterruptedSends,
  failQueuedOutboxMails,
  listQueuedOutboxMails,
} from '../../db/queries/mail-outbox';

/** A send takes seconds; a row 'sending' this long belongs to a process that died. */
export const INTERRUPTED_SEND_MS = 5 * 60_000;

export const INTERRUPTED_SEND_ERROR =
  'The sending process stopped while handing this message to the mail server; it may have ' +
  'been delivered, so it is not sent again (nobody gets it twice). Send it again if it did not arrive.';

const ORPHANED_MAILS: OrphanSpec = {
  jobName: MAIL_JOB,
  idField: 'outboxId',
  listQueued: listQueuedOutboxMails,
  failQueued: failQueuedOutboxMails,
  reason: 'The job queue lost this message.',
  // Mail waits as long as it takes: a lost message is queued again, never failed.
  requeueWithinMs: Infinity,
};

export function createMailJobKind() {
  return defineJobKind({
    name: MAIL_JOB,
    schema: z.object({ outboxId: z.uuid() }),
    expireInMinutes: 5,
    handle: async (data, { deps }) => {
      await deliverOutboxMail(deps, data.outboxId, { scheduleRetry: true });
    },
    sweep: async (deps, queue) => {
      const failed = await failInterruptedSends(deps.db, {
        before: new Date(Date.now() - INTERRUPTED_SEND_MS),
        error: INTERRUPTED_SEND_ERROR,
      });
      if (failed.length > 0) deps.logger.warn({ ids: failed }, 'mail interrupted mid-send');
      if (queue) await sweepOrphans(deps, queue, ORPHANED_MAILS);
    },
  });
}
