/**
 * What the answer path needs to know about a respondent and that never changes once their
 * session has started — their id, study, version, block, plan, start time and panel id — kept
 * per process by (link, session token), least recently used first out. Only a read that
 * checked the token against the link puts a respondent here, so a hit names the same session
 * the database would. What does change (their status, their answers, the study's status) is
 * never kept: the answer statement reads it every time (db/queries/answer-fast-path.ts).
 */
import type { RespondentRow } from '../../db/queries/respondents';

export type KnownRespondent = Pick<
  RespondentRow,
  'id' | 'studyId' | 'versionId' | 'block' | 'plan' | 'startedAt' | 'externalId'
>;

const known = new Map<string, KnownRespondent>();
/** Enough for a large panel launch answering at once; a miss only costs one read. */
const LIMIT = 10_000;

const keyOf = (publicId: string, sessionToken: string) => `${publicId}\n${sessionToken}`;

export function rememberRespondent(
  publicId: string,
  r: KnownRespondent & { sessionToken: string },
): void {
  const key = keyOf(publicId, r.sessionToken);
  known.delete(key);
  if (known.size >= LIMIT) known.delete(known.keys().next().value!);
  known.set(key, {
    id: r.id,
    studyId: r.studyId,
    versionId: r.versionId,
    block: r.block,
    plan: r.plan,
    startedAt: r.startedAt,
    externalId: r.externalId,
  });
}

export function findKnownRespondent(
  publicId: string,
  sessionToken: string,
): KnownRespondent | undefined {
  const key = keyOf(publicId, sessionToken);
  const hit = known.get(key);
  if (hit) {
    known.delete(key);
    known.set(key, hit);
  }
  return hit;
}
