/**
 * Data preparation for estimation runs and exports: a study's frozen versions, its included
 * and completed respondents (optionally narrowed by a saved filter) and their choice answers,
 * turned into coded long rows (estimation/code-answers.ts). From those rows:
 * - toBuiltChoiceData(prepared, keys): the engine's typed-array data (estimation + holdout),
 * - toLongCsvRows / toLongCsvText(prepared, keys?): the long-format CSV that
 *   `npm run estimate -- --data` reads (respondent,task,alt,chosen,holdout + coded columns),
 * - hashChoiceData(prepared, keys?): SHA-256 of that CSV, stored with each run (the estimation
 *   job takes it with hashChoiceDataInTurns: the same hash, written and digested in slices).
 */
import type { Db, DbOrTx } from '../../db/client';
import { getRespondentFilter } from '../../db/queries/respondent-filters';
import {
  listChoiceAnswers,
  listQuestionAnswers,
  type ChoiceAnswerRow,
} from '../../db/queries/study-answers';
import { listIncludedRespondents } from '../../db/queries/study-respondents';
import { listStudyVersions } from '../../db/queries/versions';
import { designSchema } from '../../shared/schemas/design';
import { z } from 'zod';
import type { RunDataOrder } from '../../shared/schemas/run';
import { studyDefinitionSchema } from '../../shared/schemas/study-definition';
import {
  codeStudyAnswers,
  type HoldoutTask,
  type PreparedChoiceData,
  type RespondentInput,
  type VersionInput,
} from './estimation/code-answers';
import { applyRespondentFilter } from './estimation/respondent-filter';
import { StudyDataError } from './estimation/study-data-error';
import { splitStoredSpec } from './estimation/run-view';
import { getSpecColumns } from '../engine/estimation/run-estimation';

export { getPreparedColumns, codeStudyAnswers } from './estimation/code-answers';
export type { PreparedChoiceData, PreparedColumn } from './estimation/code-answers';
export {
  hashChoiceData,
  hashChoiceDataInTurns,
  toBuiltChoiceData,
  toLongCsvRows,
  toLongCsvText,
  type LongCsvTable,
} from './estimation/long-format';

/**
 * Only what estimation needs from a frozen questionnaire (shared/schemas/questionnaire.ts):
 * the warm-up and holdout pages, answered under the screen keys `warmup:<pageId>` and
 * `holdout:<pageId>` (its screenKeys.special), with the holdouts' fixed alternatives.
 */
const choicePagesSchema = z.object({
  pages: z.array(
    z.looseObject({
      id: z.string(),
      kind: z.string(),
      alternatives: z.array(z.object({ levels: z.record(z.string(), z.string()) })).optional(),
    }),
  ),
});

/** Holdout tasks and warm-up screen keys of a frozen questionnaire (none if it has no pages). */
export function readChoiceScreens(questionnaire: unknown): {
  holdouts: HoldoutTask[];
  warmupKeys: string[];
} {
  const parsed = choicePagesSchema.safeParse(questionnaire);
  if (!parsed.success) return { holdouts: [], warmupKeys: [] };
  const holdouts: HoldoutTask[] = [];
  const warmupKeys: string[] = [];
  for (const page of parsed.data.pages) {
    if (page.kind === 'holdout' && page.alternatives)
      holdouts.push({ screenKey: `holdout:${page.id}`, alternatives: page.alternatives });
    if (page.kind === 'warmup') warmupKeys.push(`warmup:${page.id}`);
  }
  return { holdouts, warmupKeys };
}

/** The study's frozen versions as the coder reads them; throws when it was never live. */
export async function loadVersionInputs(db: Db | DbOrTx, studyId: string): Promise<VersionInput[]> {
  const versionRows = await listStudyVersions(db, { studyId });
  if (versionRows.length === 0)
    throw new StudyDataError('no_data', 'The study has not been live yet, so it has no answers.');
  return versionRows.map((v) => ({
    id: v.id,
    version: v.version,
    definition: studyDefinitionSchema.parse(v.definition),
    design: designSchema.parse(v.design),
    ...readChoiceScreens(v.questionnaire),
  }));
}

/**
 * The given respondents with their choice answers (answers of others are left out), in the
 * respondents' order.
 */
export function groupChoiceAnswers(
  respondents: readonly { id: string; versionId: string }[],
  answers: readonly ChoiceAnswerRow[],
): RespondentInput[] {
  const byRespondent = new Map<string, RespondentInput>(
    respondents.map((r) => [r.id, { id: r.id, versionId: r.versionId, answers: [] }]),
  );
  for (const a of answers) {
    const r = byRespondent.get(a.respondentId);
    if (r)
      (r.answers as RespondentInput['answers'][number][]).push({
        screenKey: a.screenKey,
        taskNumber: a.taskNumber,
        chosenAlternative: a.chosenAlternative,
      });
  }
  return [...byRespondent.values()];
}

/**
 * Reads and codes a study's data; `filterId` narrows the respondents to a saved filter, and
 * `order` is the run's data order (the current one unless an older run is computed again).
 */
export async function loadStudyChoiceData(
  db: Db | DbOrTx,
  params: { studyId: string; filterId?: string | null; order?: RunDataOrder },
): Promise<PreparedChoiceData> {
  const versions = await loadVersionInputs(db, params.studyId);
  let included = await listIncludedRespondents(db, { studyId: params.studyId });
  if (params.filterId) {
    const filter = await getRespondentFilter(db, {
      id: params.filterId,
      studyId: params.studyId,
    });
    if (!filter) throw new StudyDataError('no_data', 'The saved filter no longer exists.');
    const keep = applyRespondentFilter(
      filter.definition,
      included.map((r) => r.id),
      await listQuestionAnswers(db, { studyId: params.studyId }),
    );
    included = included.filter((r) => keep.has(r.id));
  }
  const answers = await listChoiceAnswers(db, { studyId: params.studyId });
  return codeStudyAnswers(versions, groupChoiceAnswers(included, answers), params.order);
}

/**
 * The data a run is estimated on, as its stored spec says: the respondents of its saved filter
 * (all included ones without), read in its data order, and the coded columns of its
 * coefficients. The estimation job and the run's choice download both read it here, so the
 * download is the run's data to the byte (its SHA-256 is the run's data hash).
 */
export async function loadRunChoiceData(
  db: Db | DbOrTx,
  params: { studyId: string; storedSpec: unknown },
) {
  const { spec, respondents, dataOrder } = splitStoredSpec(params.storedSpec);
  const prepared = await loadStudyChoiceData(db, {
    studyId: params.studyId,
    filterId: respondents.filterId,
    order: dataOrder,
  });
  return { spec, prepared, keys: getSpecColumns(spec) };
}
