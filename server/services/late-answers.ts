/**
 * Answers given before a close that arrive after it: a phone that was offline, or an answer
 * that waited in the phone's outbox while the researcher closed the study. They were given
 * while the study was open, so they count, for a grace period after the close (a study
 * setting). The phone says how long ago each answer was given, by its own clock; arrival time
 * minus that age bounds the moment of answering from above (transit only makes it later), so
 * an answer is never taken for earlier than it was.
 */
import type { FieldworkSettings } from '../../shared/schemas/study-lifecycle';

/**
 * Slack for the request's own transit when the phone says the answer's age (common practice,
 * no source: a slow mobile request). Without an age the answer counts as given on arrival.
 */
export const LATE_ANSWER_TRANSIT_MS = 10_000;
const HOUR_MS = 3_600_000;

/** When answering stopped: the closing date for a scheduled close, else when it was closed. */
export function closeMoment(settings: FieldworkSettings): Date | null {
  if (!settings.closedAt) return null;
  const closed = new Date(settings.closedAt);
  if (settings.closedReason === 'date' && settings.closeAt) {
    const due = new Date(settings.closeAt);
    if (due < closed) return due;
  }
  return closed;
}

export type LateAnswerVerdict = 'accept' | 'given_after_close' | 'grace_over' | 'not_closed';

/** Whether a closed study still takes this answer of a session that started before the close. */
export function judgeLateAnswer(params: {
  status: string;
  settings: FieldworkSettings;
  startedAt: Date;
  ageMs: number | undefined;
  now: Date;
}): LateAnswerVerdict {
  const { settings, now } = params;
  const closed = params.status === 'closed' ? closeMoment(settings) : null;
  if (!closed) return 'not_closed';
  if (params.startedAt.getTime() > closed.getTime()) return 'given_after_close';
  if (now.getTime() > closed.getTime() + settings.lateAnswerGraceHours * HOUR_MS)
    return 'grace_over';
  if (params.ageMs === undefined) return 'given_after_close';
  const givenAt = now.getTime() - params.ageMs;
  return givenAt <= closed.getTime() + LATE_ANSWER_TRANSIT_MS ? 'accept' : 'given_after_close';
}
