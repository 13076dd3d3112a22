/**
 * Segment quotas: completes wanted per answer group of a screening question (age groups,
 * regions). Two moments decide. At the screening answer, a respondent whose cell is already
 * full leaves as over quota, so nobody answers the whole survey for nothing. At completion,
 * under the study's completion lock (answer-quota.ts), the cell is counted again: respondents
 * who passed screening together while one place was left cannot both count, so a cell never
 * exceeds its target. Only completes count towards a cell, as with the study-wide quota.
 */
import type { DbOrTx } from '../../db/client';
import { listAnswerValues } from '../../db/queries/answers';
import { countCompletesByAnswer } from '../../db/queries/quota-counts';
import {
  screenKeys,
  type Questionnaire,
  type ScreeningPage,
} from '../../shared/schemas/questionnaire';
import type { AnswerValue, RespondentStatus } from '../../shared/schemas/respondent';
import { quotaCellOf } from '../../shared/survey/quota-cells';
import type { FrozenVersion } from './respondent-screens';
import { pageOfScreen } from './respondent-screen-index';

/** The screening pages of a questionnaire that carry quota cells. */
export function quotaPagesOf(questionnaire: Questionnaire): ScreeningPage[] {
  return questionnaire.pages.filter(
    (p): p is ScreeningPage => p.kind === 'screening' && p.quotaCells.length > 0,
  );
}

/** Whether storing this answer with this status needs a quota decision (the full path makes it). */
export function segmentQuotaApplies(
  version: FrozenVersion,
  screenKey: string,
  status: RespondentStatus,
): boolean {
  if (status === 'completed') return quotaPagesOf(version.questionnaire).length > 0;
  const page = pageOfScreen(version, screenKey);
  return status === 'in_progress' && page?.kind === 'screening' && page.quotaCells.length > 0;
}

/** Completes so far per cell id of one quota page. */
export async function completesPerCell(
  db: DbOrTx,
  params: { studyId: string; page: ScreeningPage },
): Promise<Map<string, number>> {
  const rows = await countCompletesByAnswer(db, {
    studyId: params.studyId,
    screenKey: screenKeys.question(params.page.question.key),
  });
  const counts = new Map(params.page.quotaCells.map((c) => [c.id, 0]));
  for (const row of rows) {
    const cell = quotaCellOf(params.page, row.value);
    if (cell) counts.set(cell.id, counts.get(cell.id)! + row.n);
  }
  return counts;
}

async function cellIsFull(db: DbOrTx, studyId: string, page: ScreeningPage, value: AnswerValue) {
  const cell = quotaCellOf(page, value);
  if (!cell) return false;
  const counts = await completesPerCell(db, { studyId, page });
  return counts.get(cell.id)! >= cell.target;
}

/** At the screening answer: whether the cell this answer falls in is full already. */
export async function screeningCellIsFull(
  db: DbOrTx,
  params: { studyId: string; version: FrozenVersion; screenKey: string; value: AnswerValue },
): Promise<boolean> {
  const page = pageOfScreen(params.version, params.screenKey);
  if (page?.kind !== 'screening' || page.quotaCells.length === 0) return false;
  return cellIsFull(db, params.studyId, page, params.value);
}

/** At completion (inside the completion lock): whether any of the respondent's cells is full. */
export async function respondentCellIsFull(
  db: DbOrTx,
  params: { studyId: string; respondentId: string; version: FrozenVersion },
): Promise<boolean> {
  const pages = quotaPagesOf(params.version.questionnaire);
  if (pages.length === 0) return false;
  const given = await listAnswerValues(db, { respondentId: params.respondentId });
  for (const page of pages) {
    const value = given.get(screenKeys.question(page.question.key)) as AnswerValue | undefined;
    if (value && (await cellIsFull(db, params.studyId, page, value))) return true;
  }
  return false;
}
