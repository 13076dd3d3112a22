/**
 * The Tasks section's use cases: read the current design and the latest generation job,
 * start a generation job (off the request path), cancel it, import and export a design CSV.
 */
import type { AppDeps } from '../deps';
import { AppError, ConflictError, NotFoundError, ValidationError } from '../lib/errors';
import { loadStudy } from './study-access';
import { getCandidateView } from './redesign';
import { toDesignView, toJobView } from './design-view';
import { loadDraftStudy } from './studies';
import { DESIGN_JOB } from '../jobs/design-job';
import { checkDesignSpec } from '../engine/design/check-design-spec';
import { DesignError } from '../engine/design/design-errors';
import { diagnoseDesign } from '../engine/design/diagnostics/diagnose-design';
import { importDesignCsv } from '../engine/design/import-design-csv';
import { exportDesignCsv } from '../engine/design/export-design-csv';
import { getDesignById, insertCurrentDesign } from '../../db/queries/designs';
import {
  getActiveDesignJob,
  getDesignJob,
  getLatestDesignJob,
  insertDesignJob,
  requestDesignJobCancel,
} from '../../db/queries/design-jobs';
import { studyDefinitionSchema, type StudyDefinition } from '../../shared/schemas/study-definition';
import type { Design } from '../../shared/schemas/design';
import type { DesignJobView } from '../../shared/schemas/design-job';
import type { Actor } from './actor';

/** The engine's errors in the API's error model. */
export function toAppError(err: DesignError): AppError {
  const fields = Object.entries(err.fields ?? {}).map(([path, message]) => ({ path, message }));
  if (err.code === 'invalid_spec') return new ValidationError(err.message, fields, 'invalid_spec');
  return new AppError(422, err.code, err.message, fields);
}

function definitionOf(study: { definition: unknown }): StudyDefinition {
  return studyDefinitionSchema.parse(study.definition);
}

export async function getDesignState(deps: AppDeps, teamId: string, studyId: string) {
  const study = await loadStudy(deps, teamId, studyId);
  const row = study.currentDesignId
    ? await getDesignById(deps.db, { id: study.currentDesignId, teamId })
    : null;
  const job = await getLatestDesignJob(deps.db, { studyId, teamId });
  return {
    design: row ? toDesignView(row) : null,
    candidate: await getCandidateView(deps, teamId, studyId, study.currentDesignId),
    job: job ? toJobView(job) : null,
  };
}

export async function startDesignJob(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  specInput: unknown,
): Promise<DesignJobView> {
  const study = await loadDraftStudy(deps, actor.teamId, studyId, 'its choice tasks');
  return queueDesignJob(deps, actor, study, specInput, 'attach');
}

/**
 * Checks the spec against the study and queues a generation job: 'attach' makes the result the
 * current design, 'candidate' keeps it beside the current one (services/redesign.ts).
 */
export async function queueDesignJob(
  deps: AppDeps,
  actor: Actor,
  study: { id: string; definition: unknown },
  specInput: unknown,
  purpose: 'attach' | 'candidate',
): Promise<DesignJobView> {
  const studyId = study.id;
  let spec;
  try {
    spec = checkDesignSpec(definitionOf(study), specInput).spec;
  } catch (err) {
    if (err instanceof DesignError) throw toAppError(err);
    throw err;
  }
  if (!deps.jobs)
    throw new AppError(503, 'jobs_unavailable', 'Background jobs are not running. Try again soon.');
  if (await getActiveDesignJob(deps.db, { studyId, teamId: actor.teamId }))
    throw new ConflictError('job_running', 'A design is already being generated for this study.');
  const jobs = deps.jobs;
  // The row and its queue message are committed together (or neither is).
  const job = await deps.db.transaction(async (tx) => {
    const row = await insertDesignJob(tx, {
      studyId,
      teamId: actor.teamId,
      spec,
      purpose,
      createdBy: actor.userId,
    });
    await jobs.send(DESIGN_JOB, { designJobId: row.id }, { tx }).catch((err: unknown) => {
      deps.logger.error({ err }, 'could not enqueue the design job');
      throw new AppError(
        503,
        'jobs_unavailable',
        'The design could not be queued; try again soon.',
      );
    });
    return row;
  });
  return toJobView(job);
}

export async function getDesignJobView(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  jobId: string,
): Promise<DesignJobView> {
  const job = await getDesignJob(deps.db, { id: jobId, teamId });
  if (!job || job.studyId !== studyId) throw new NotFoundError('Design job');
  return toJobView(job);
}

export async function cancelDesignJob(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  jobId: string,
): Promise<DesignJobView> {
  const job = await getDesignJobView(deps, teamId, studyId, jobId);
  if (job.status !== 'queued' && job.status !== 'running')
    throw new ConflictError(
      'job_finished',
      `This job has already ${job.status === 'done' ? 'finished' : job.status}.`,
    );
  const row = await requestDesignJobCancel(deps.db, { id: jobId, teamId });
  return row ? toJobView(row) : getDesignJobView(deps, teamId, studyId, jobId);
}

/** Imports a design CSV; on any row error nothing is saved and every error is reported. */
export async function importDesign(deps: AppDeps, actor: Actor, studyId: string, text: string) {
  const study = await loadDraftStudy(deps, actor.teamId, studyId, 'its choice tasks');
  const definition = definitionOf(study);
  if (definition.attributes.length === 0)
    throw new ValidationError('Add attributes before importing a design.', [
      { path: 'file', message: 'The study has no attributes yet' },
    ]);
  const parsed = importDesignCsv(definition, text);
  if (!parsed.ok)
    throw new ValidationError(
      `The file has ${parsed.errors.length} problem${parsed.errors.length === 1 ? '' : 's'}; nothing was imported.`,
      parsed.errors.map((e) => ({
        path: `rows.${e.row}${e.column ? `.${e.column}` : ''}`,
        message: e.message,
      })),
      'invalid_csv',
    );
  const diagnostics = diagnoseDesign(definition, parsed.design, { kind: 'zero' });
  await deps.db.transaction(async (tx) => {
    await insertCurrentDesign(tx, {
      studyId,
      teamId: actor.teamId,
      method: 'imported',
      spec: { method: 'imported', blocks: parsed.design.blocks, priors: { kind: 'zero' } },
      design: parsed.design,
      diagnostics,
      createdBy: actor.userId,
    });
  });
  return getDesignState(deps, actor.teamId, studyId);
}

export async function exportDesign(deps: AppDeps, teamId: string, studyId: string) {
  const study = await loadStudy(deps, teamId, studyId);
  const row = study.currentDesignId
    ? await getDesignById(deps.db, { id: study.currentDesignId, teamId })
    : null;
  if (!row) throw new NotFoundError('Design');
  return {
    filename: `${study.name.replace(/[^A-Za-z0-9-]+/g, '-').toLowerCase() || 'study'}-design.csv`,
    csv: exportDesignCsv(definitionOf(study), row.design as Design),
  };
}
