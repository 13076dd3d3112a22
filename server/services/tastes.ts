/**
 * Tastes use cases: the finished runs that have taste profiles, one page of the profile table
 * (sorted and filtered in SQL), segments of a coefficient's conditional means, and one
 * respondent's page. Roles: 'runs:read' (checked by the route); personal columns only with
 * 'personal:read' (run-context.ts decides).
 */
import type { AppDeps } from '../deps';
import { ValidationError } from '../lib/errors';
import { loadStudy } from './study-access';
import { listFinishedRuns } from '../../db/queries/runs';
import { listQuestionAnswers } from '../../db/queries/study-answers';
import { listTasteRows, type TasteSort } from '../../db/queries/taste-profile-table';
import type {
  ListTastesQuery,
  TasteHeader,
  TasteList,
  TastesRun,
} from '../../shared/schemas/tastes';
import type { RunResult } from '../../shared/schemas/run';
import type { ModelFamily } from '../../shared/schemas/estimation-families';
import { loadRunContext } from './tastes/run-context';
import { indexAnswers } from './tastes/background-answers';
import { toTasteRow } from './tastes/taste-rows';
import { getWtpUnavailableReason } from './exports/estimate-tables';
import type { EstimationSpec } from '../../shared/schemas/estimation-spec';
import type { Actor } from './actor';

export { getSegments } from './tastes/get-segments';
export { getRespondentProfile } from './tastes/get-respondent-profile';
export { compareRuns } from './tastes/compare-runs';

export async function listTastesRuns(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
): Promise<TastesRun[]> {
  await loadStudy(deps, actor.teamId, studyId);
  const rows = await listFinishedRuns(deps.db, { teamId: actor.teamId, studyId });
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    model: r.model as ModelFamily,
    finishedAt: r.finishedAt?.toISOString() ?? null,
    profiles: r.profiles,
    profileDraws: (r.results as RunResult | null)?.profileDraws?.count ?? null,
    erasedRespondents: r.erasedRespondents,
    wtpUnavailable: r.results
      ? getWtpUnavailableReason(r.spec as EstimationSpec, r.results as RunResult)
      : null,
  }));
}

/** Parses `sort` against the run's coefficients; an unknown coefficient is a 400 on `sort`. */
export function resolveSort(sort: string, header: TasteHeader): TasteSort {
  if (sort === 'number' || sort === 'effectiveDraws') return { by: sort };
  const [by, coefficient] = sort.split(/:(.*)/s) as ['mean' | 'sd' | 'wtp', string];
  const known = by === 'wtp' ? header.wtp : header.coefficients.map((c) => c.name);
  if (!known.includes(coefficient))
    throw new ValidationError(`The run has no ${by === 'wtp' ? 'WTP for ' : ''}${coefficient}.`, [
      { path: 'sort', message: `Unknown column ${sort}` },
    ]);
  return { by, coefficient };
}

export async function listTastes(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  query: ListTastesQuery,
): Promise<TasteList> {
  const { header } = await loadRunContext(deps, actor, studyId, query.runId);
  const sort = resolveSort(query.sort, header);
  if ((query.question === undefined) !== (query.answer === undefined))
    throw new ValidationError('Give a question and an answer to filter by.', [
      { path: query.question === undefined ? 'question' : 'answer', message: 'Give both' },
    ]);
  if (query.question && !header.questions.some((q) => q.key === query.question))
    throw new ValidationError('Unknown question.', [
      { path: 'question', message: 'Unknown question' },
    ]);
  const { rows, total } = await listTasteRows(deps.db, {
    runId: query.runId,
    studyId,
    sort,
    dir: query.dir,
    lowDrawsBelow: header.lowDrawsThreshold,
    lowDraws: query.lowDraws,
    flagged: query.flagged,
    answer: query.question ? { key: query.question, value: query.answer! } : undefined,
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  const answers = indexAnswers(
    await listQuestionAnswers(deps.db, { studyId, respondentIds: rows.map((r) => r.respondentId) }),
  );
  return {
    ...header,
    page: query.page,
    pageSize: query.pageSize,
    total,
    rows: rows.map((r) => toTasteRow(r, header, answers.get(r.respondentId))),
  };
}
