/**
 * Estimation runs of a study: what the Models form can use, starting a run (validated here,
 * executed by a worker through the job queue), reading runs and their conditional means, and
 * cancelling. The web process never estimates; it only enqueues and reads.
 */
import type { AppDeps } from '../deps';
import { recordAudit } from './audit';
import { AppError, ConflictError, NotFoundError, ValidationError } from '../lib/errors';
import { loadStudy } from './study-access';
import { getPreparedColumns } from './estimation/code-answers';
import { assertRunFitsMemory } from './estimation/run-memory';
import { assertFamilyFitsData } from './estimation/family-data-checks';
import { assertMembershipQuestions, listMembershipQuestions } from './estimation/study-membership';
import { getRunSeed, toRunView } from './estimation/run-view';
import type { ModelFamily } from '../../shared/schemas/estimation-families';
import {
  countRuns,
  getRunById,
  insertRun,
  listRuns as listRunRows,
  requestRunCancel,
} from '../../db/queries/runs';
import {
  getRespondentFilter,
  insertRespondentFilter,
  listRespondentFilters,
} from '../../db/queries/respondent-filters';
import { listIncludedRespondents } from '../../db/queries/study-respondents';
import { listStudyVersions } from '../../db/queries/versions';
import { listRunProfiles } from '../../db/queries/taste-profiles';
import { studyDefinitionSchema } from '../../shared/schemas/study-definition';
import { getWtpUnit } from '../../shared/engine/coding/wtp-unit';
import {
  RUN_DATA_ORDER,
  type ConditionalMeans,
  type CreateRun,
  type RespondentFilterDefinition,
  type Run,
  type RunOptions,
} from '../../shared/schemas/run';
import type { EstimationSpec } from '../../shared/schemas/estimation-spec';
import type { Actor } from './actor';

export const ESTIMATION_JOB = 'estimation-run';

/** The name of a run started without one. */
const DEFAULT_RUN_NAMES: Record<ModelFamily, string> = {
  mnl: 'Multinomial logit',
  mixed: 'Mixed logit',
  hb: 'Hierarchical Bayes logit',
  latent_class: 'Latent class logit',
};

/** The definition runs are coded with: the latest live version's, else the draft's. */
async function getCodingDefinition(deps: AppDeps, study: { id: string; definition: unknown }) {
  const versions = await listStudyVersions(deps.db, { studyId: study.id });
  const latest = versions[versions.length - 1];
  return studyDefinitionSchema.parse(latest ? latest.definition : study.definition);
}

async function getModelColumns(deps: AppDeps, study: { id: string; definition: unknown }) {
  return getPreparedColumns(await getCodingDefinition(deps, study));
}

export async function getRunOptions(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
): Promise<RunOptions> {
  const study = await loadStudy(deps, actor.teamId, studyId);
  const [columns, included, filters, runCount, membershipQuestions] = await Promise.all([
    getModelColumns(deps, study),
    listIncludedRespondents(deps.db, { studyId }),
    listRespondentFilters(deps.db, { studyId }),
    countRuns(deps.db, { teamId: actor.teamId, studyId }),
    listMembershipQuestions(deps.db, study),
  ]);
  return {
    columns: columns.map((c) => ({
      key: c.key,
      code: c.code,
      label: c.name,
      kind: c.kind,
      attributeId: c.attributeId ?? null,
      isCost: c.isCost,
    })),
    includedRespondents: included.length,
    filters,
    hasRuns: runCount > 0,
    membershipQuestions,
  };
}

/** Ties every coefficient to a coded-column key (given as key or code); 400 names the field. */
function resolveSpecColumns(
  spec: EstimationSpec,
  columns: { key: string; code: string }[],
): EstimationSpec {
  const fields: { path: string; message: string }[] = [];
  const coefficients = spec.coefficients.map((c, i) => {
    const wanted = c.column ?? c.name;
    const column = columns.find((x) => x.key === wanted || x.code === wanted);
    if (!column)
      fields.push({
        path: `spec.coefficients.${i}.column`,
        message: `The study has no coded column ${wanted}`,
      });
    return { ...c, column: column?.key ?? wanted };
  });
  const keys = coefficients.map((c) => c.column);
  keys.forEach((key, i) => {
    if (keys.indexOf(key) !== i)
      fields.push({
        path: `spec.coefficients.${i}.column`,
        message: 'Each coded column can have one coefficient only',
      });
  });
  if (fields.length > 0) throw new ValidationError(fields[0].message, fields);
  return { ...spec, coefficients };
}

export async function createRun(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  input: CreateRun,
): Promise<Run> {
  const study = await loadStudy(deps, actor.teamId, studyId);
  const spec = resolveSpecColumns(input.spec, await getModelColumns(deps, study));
  const filterId = input.respondents.filterId;
  if (filterId && !(await getRespondentFilter(deps.db, { id: filterId, studyId })))
    throw new ValidationError('There is no such saved filter', [
      { path: 'respondents.filterId', message: 'There is no such saved filter' },
    ]);
  await assertRunFitsMemory(deps, studyId, spec);
  await assertMembershipQuestions(deps.db, study, spec);
  await assertFamilyFitsData(deps, studyId, spec, filterId);
  if (!deps.jobs)
    throw new AppError(503, 'queue_unavailable', 'The job queue is not running; try again soon.');
  const jobs = deps.jobs;
  // The run and its queue message are committed together, or neither is: no run waits for a
  // message that was never sent (orphan-sweep.ts catches messages lost later).
  const row = await deps.db.transaction(async (tx) => {
    const inserted = await insertRun(tx, {
      studyId,
      teamId: actor.teamId,
      name: input.name || DEFAULT_RUN_NAMES[spec.model],
      model: spec.model,
      spec: { ...spec, respondents: { filterId }, dataOrder: RUN_DATA_ORDER },
      seed: getRunSeed(spec),
      createdBy: actor.userId,
    });
    await jobs.send(ESTIMATION_JOB, { runId: inserted.id }, { tx }).catch((err: unknown) => {
      deps.logger.error({ err }, 'could not enqueue the run');
      throw new AppError(503, 'queue_unavailable', 'The run could not be queued; try again soon.');
    });
    return inserted;
  });
  await recordAudit(deps.db, {
    teamId: actor.teamId,
    studyId,
    actor,
    action: 'run.started',
    targetType: 'run',
    targetId: row.id,
    details: { name: row.name, model: row.model },
  });
  return toRunView(row);
}

export async function listRuns(deps: AppDeps, actor: Actor, studyId: string): Promise<Run[]> {
  await loadStudy(deps, actor.teamId, studyId);
  const rows = await listRunRows(deps.db, { teamId: actor.teamId, studyId });
  return rows.map(toRunView);
}

async function loadRun(deps: AppDeps, actor: Actor, studyId: string, runId: string) {
  const study = await loadStudy(deps, actor.teamId, studyId);
  const row = await getRunById(deps.db, { id: runId, teamId: actor.teamId, studyId });
  if (!row) throw new NotFoundError('Run');
  return { row, study };
}

/** One run, its columns with the unit and basis of their WTP (from the coding definition). */
export async function getRun(deps: AppDeps, actor: Actor, studyId: string, runId: string) {
  const { row, study } = await loadRun(deps, actor, studyId, runId);
  const run = toRunView(row);
  if (!run.results) return run;
  const definition = await getCodingDefinition(deps, study);
  const columns = run.results.columns.map((c) => ({
    ...c,
    wtpUnit: getWtpUnit(definition, c.key),
  }));
  const costUnit = definition.attributes.find((a) => a.isCost)?.unit?.trim() || null;
  return { ...run, results: { ...run.results, columns, costUnit } };
}

/** Queued runs end at once; running ones stop at their next iteration (the worker checks). */
export async function cancelRun(deps: AppDeps, actor: Actor, studyId: string, runId: string) {
  await loadRun(deps, actor, studyId, runId);
  const row = await requestRunCancel(deps.db, { id: runId, teamId: actor.teamId, studyId });
  if (!row) throw new ConflictError('run_finished', 'The run has already finished.');
  await recordAudit(deps.db, {
    teamId: actor.teamId,
    studyId,
    actor,
    action: 'run.cancelled',
    targetType: 'run',
    targetId: runId,
    details: { name: row.name },
  });
  return toRunView(row);
}

/** Respondents' conditional means per coefficient (for density charts); no respondent ids. */
export async function getConditionalMeans(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  runId: string,
): Promise<ConditionalMeans> {
  const { row } = await loadRun(deps, actor, studyId, runId);
  const coefficients = toRunView(row).spec.coefficients.map((c) => c.name);
  const profiles = await listRunProfiles(deps.db, { runId: row.id, studyId: row.studyId });
  return {
    coefficients,
    values: coefficients.map((name) =>
      profiles.map((p) => (p.mean as Record<string, number>)[name] ?? NaN),
    ),
    effectiveDraws: profiles.map((p) => p.effectiveDraws),
  };
}

/** Saves a named respondent filter that runs can use. */
export async function saveRespondentFilter(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  input: { name: string; definition: RespondentFilterDefinition },
) {
  await loadStudy(deps, actor.teamId, studyId);
  return insertRespondentFilter(deps.db, { studyId, ...input });
}
