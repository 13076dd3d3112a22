/**
 * Completing in a study with a quota of completes. The completion takes a row lock on the
 * study (FOR NO KEY UPDATE, so answers keep flowing), counts the completes committed before
 * it, and stores the last answer with the status that count allows: completed while the quota
 * has room, over quota once it is full. The completion that fills the quota closes the study
 * in the same transaction. So the quota is never exceeded, however many finish at once.
 * Segment quotas (segment-quotas.ts) are counted under the same lock, for the same reason.
 */
import type { Db } from '../../db/client';
import { insertAnswerAndFinish } from '../../db/queries/answers';
import { countCompletes } from '../../db/queries/respondents';
import { lockStudyForCompletion } from '../../db/queries/versions';
import { closeLockedStudy, readSettings } from './lifecycle';
import type { FrozenVersion } from './respondent-screens';
import { respondentCellIsFull } from './segment-quotas';

type AnswerRow = Omit<Parameters<typeof insertAnswerAndFinish>[1], 'finish'>;

/** 'completed' or 'over_quota' when stored; null when the unique indexes refused the answer. */
export async function completeUnderQuota(
  db: Db,
  params: {
    studyId: string;
    row: AnswerRow;
    durationMs: number;
    now: Date;
    version: FrozenVersion;
  },
): Promise<'completed' | 'over_quota' | null> {
  return db.transaction(async (tx) => {
    const study = await lockStudyForCompletion(tx, { id: params.studyId });
    if (!study) return null;
    const settings = readSettings(study.settings);
    const quota = settings.quotaCompletes;
    const completes = quota === null ? 0 : await countCompletes(tx, { studyId: study.id });
    const full =
      (study.status === 'closed' && settings.closedReason === 'quota') ||
      (quota !== null && completes >= quota) ||
      (await respondentCellIsFull(tx, {
        studyId: study.id,
        respondentId: params.row.respondentId,
        version: params.version,
      }));
    const status = full ? 'over_quota' : 'completed';
    const stored = await insertAnswerAndFinish(tx, {
      ...params.row,
      finish: { status, durationMs: params.durationMs },
    });
    if (!stored) return null;
    if (!full && study.status === 'live' && quota !== null && completes + 1 >= quota)
      await closeLockedStudy(tx, study, 'quota', params.now);
    return status;
  });
}
