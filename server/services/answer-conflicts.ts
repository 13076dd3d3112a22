/**
 * What an answer the unique indexes refused means. The same client id with the same screen
 * and value is a retry (a phone that lost the reply): it gets its receipt again and nothing
 * changes. The same client id with another screen or another value is a client bug or a
 * tampered request: 409 naming the screen the id belongs to. Another answer for an answered
 * screen, or an answer after the session ended, is a conflict too.
 */
import { isDeepStrictEqual } from 'node:util';
import type { DbOrTx } from '../../db/client';
import { ConflictError } from '../lib/errors';
import { getRespondentAnswerState } from '../../db/queries/respondents';
import type {
  AnswerReceipt,
  RespondentScreen,
  RespondentStatus,
} from '../../shared/schemas/respondent';
import type { AnswerInput } from './answer-shape';

/** The stored value holds what the client sent plus fields the server derived (task kind …). */
function sameValue(stored: unknown, sent: AnswerInput['value']): boolean {
  if (!stored || typeof stored !== 'object') return false;
  return Object.entries(sent).every(([k, v]) =>
    isDeepStrictEqual((stored as Record<string, unknown>)[k], v),
  );
}

/** Whether the answer stored under a client id is this very answer sent again (a retry). */
export function isRetryOf(
  stored: { screenKey: string; value: unknown },
  answer: Pick<AnswerInput, 'screenKey' | 'value'>,
): boolean {
  return stored.screenKey === answer.screenKey && sameValue(stored.value, answer.value);
}

/** Where a respondent goes on: the first of their screens without an answer (or past the end). */
export function nextUnanswered(screens: RespondentScreen[], answered: Iterable<string>): number {
  const keys = new Set(answered);
  const next = screens.findIndex((s) => !keys.has(s.key));
  return next < 0 ? screens.length : next;
}

export async function resolveRefusedAnswer(
  db: DbOrTx,
  params: {
    respondent: { id: string; status: RespondentStatus };
    answer: AnswerInput;
    screens: RespondentScreen[];
    receipt: (status: RespondentStatus, replay: boolean, answered: number) => AnswerReceipt;
  },
): Promise<AnswerReceipt> {
  const { answer } = params;
  const state = await getRespondentAnswerState(db, { respondentId: params.respondent.id });
  const status = state?.status ?? params.respondent.status;
  const stored = state?.answers ?? [];
  const mine = stored.find((a) => a.clientId === answer.clientId);
  if (mine) {
    if (!isRetryOf(mine, answer))
      throw new ConflictError(
        'client_id_reused',
        `This answer id was already used for the screen "${mine.screenKey}" with ${
          mine.screenKey === answer.screenKey ? 'another answer' : 'its own answer'
        }; nothing was changed.`,
        [{ path: 'clientId', message: `Already used for ${mine.screenKey}` }],
      );
    const next = nextUnanswered(
      params.screens,
      stored.map((a) => a.screenKey),
    );
    return params.receipt(status, true, next);
  }
  if (status === 'completed')
    throw new ConflictError(
      'already_completed',
      'This questionnaire is complete; no more answers can be added.',
    );
  if (status !== 'in_progress')
    throw new ConflictError(
      'already_finished',
      'This session has ended; no more answers can be added.',
    );
  throw new ConflictError(
    'already_answered',
    `The screen "${answer.screenKey}" already has an answer; it cannot be changed.`,
    [{ path: 'screenKey', message: 'Already answered' }],
  );
}
