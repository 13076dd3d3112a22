/**
 * Pilot → priors → redesign: a finished run's estimates as priors (redesign/priors-from-run.ts),
 * a candidate design generated beside the current one and compared with it under the new
 * priors (in the design worker), then adopted or discarded. Adopting on a live study freezes a
 * new version: respondents already in progress keep theirs (respondents.version_id), new
 * sessions start on the latest version (respondent-session.ts).
 */
import type { AppDeps } from '../deps';
import { AppError, ConflictError, NotFoundError } from '../lib/errors';
import { loadStudy, lockStudyOrThrow } from './study-access';
import { recordAudit } from './audit';
import { queueDesignJob } from './designs';
import { toDesignView } from './design-view';
import { designFitsDefinition } from './design-fit';
import { toRunView } from './estimation/run-view';
import { buildPriorsFromRun } from './redesign/priors-from-run';
import { getLatestCandidateJob } from '../../db/queries/design-jobs';
import { deleteDesign, getDesignById } from '../../db/queries/designs';
import { getRunById } from '../../db/queries/runs';
import { updateStudy } from '../../db/queries/studies';
import { getLatestVersion, insertVersion, updateStudyLifecycle } from '../../db/queries/versions';
import type { Design } from '../../shared/schemas/design';
import type { DesignState } from '../../shared/schemas/design-job';
import type { CriterionComparison, RunPriors, RunPriorsQuery } from '../../shared/schemas/redesign';
import { studyDefinitionSchema } from '../../shared/schemas/study-definition';
import { questionnaireSchema } from '../../shared/schemas/questionnaire';
import { checkStudyTexts } from './readiness-texts';
import type { Actor } from './actor';

/** The run's estimates as Bayesian priors for the study's current attributes. */
export async function getRunPriors(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  query: RunPriorsQuery,
): Promise<RunPriors> {
  const study = await loadStudy(deps, teamId, studyId);
  const row = await getRunById(deps.db, { id: query.runId, teamId, studyId });
  if (!row) throw new NotFoundError('Run');
  // Runs code their data with the latest version's definition (runs.ts), else the draft's.
  const latest = await getLatestVersion(deps.db, { studyId });
  return buildPriorsFromRun({
    run: toRunView(row),
    runDefinition: studyDefinitionSchema.parse(latest?.definition ?? study.definition),
    current: studyDefinitionSchema.parse(study.definition),
    spread: query.spread,
  });
}

/** Queues a candidate design beside the current one (any study status). */
export async function startCandidateJob(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  specInput: unknown,
) {
  const study = await loadStudy(deps, actor.teamId, studyId);
  if (!study.currentDesignId)
    throw new ConflictError(
      'no_current_design',
      'The study has no design yet to compare with; generate one first.',
    );
  return queueDesignJob(deps, actor, study, specInput, 'candidate');
}

/** The candidate waiting beside the current design, or null. */
export async function getCandidateView(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  currentDesignId: string | null,
): Promise<DesignState['candidate']> {
  const job = await getLatestCandidateJob(deps.db, { studyId, teamId });
  if (!job?.designId || job.status !== 'done' || job.designId === currentDesignId) return null;
  const row = await getDesignById(deps.db, { id: job.designId, teamId });
  if (!row || row.studyId !== studyId) return null;
  const stored = row.diagnostics as { comparison?: CriterionComparison[] };
  return { ...toDesignView(row), comparison: stored.comparison ?? [] };
}

async function loadCandidate(deps: AppDeps, teamId: string, studyId: string, designId: string) {
  const study = await loadStudy(deps, teamId, studyId);
  const candidate = await getCandidateView(deps, teamId, studyId, study.currentDesignId);
  if (!candidate || candidate.id !== designId) throw new NotFoundError('Candidate design');
  return candidate;
}

/**
 * Makes the candidate the study's design. A live study gets a new frozen version at once
 * (definition and questionnaire unchanged, the new design); a draft or closed one freezes it
 * when it next goes live.
 */
export async function adoptCandidate(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  designId: string,
) {
  const candidate = await loadCandidate(deps, actor.teamId, studyId, designId);
  const result = await deps.db.transaction(async (tx) => {
    const study = await lockStudyOrThrow(tx, actor.teamId, studyId);
    // A second adopt of the same candidate, racing the first, must not freeze another version.
    if (study.currentDesignId === candidate.id) throw new NotFoundError('Candidate design');
    const definition = studyDefinitionSchema.parse(study.definition);
    if (!designFitsDefinition(definition, candidate.design as Design))
      throw new ConflictError(
        'attributes_changed',
        'The attributes changed since this design was generated; generate it again.',
      );
    await updateStudy(tx, {
      id: studyId,
      teamId: actor.teamId,
      set: { currentDesignId: candidate.id },
    });
    let version: number | null = null;
    if (study.status === 'live') {
      const questionnaire = questionnaireSchema.parse(study.questionnaire);
      const missing = checkStudyTexts(
        { publicTitle: study.publicTitle, definition, questionnaire },
        { languages: study.languages, translations: study.translations },
      );
      if (missing.length > 0)
        throw new AppError(
          422,
          'not_ready',
          'The new design cannot be frozen while a language lacks texts.',
          missing.map((p) => ({ path: p.path, message: p.message })),
        );
      const latest = await getLatestVersion(tx, { studyId });
      version = (latest?.version ?? 0) + 1;
      await insertVersion(tx, {
        studyId,
        version,
        definition: study.definition,
        design: candidate.design,
        questionnaire: study.questionnaire,
        languages: study.languages,
        translations: study.translations,
      });
      await updateStudyLifecycle(tx, {
        id: studyId,
        teamId: actor.teamId,
        status: 'live',
        settings: study.settings,
        currentVersion: version,
      });
    }
    await recordAudit(tx, {
      teamId: actor.teamId,
      studyId,
      actor,
      action: 'study.design_adopted',
      details: { study: study.name, designId: candidate.id, version },
    });
    return { version, status: study.status };
  });
  return { ...result, designId: candidate.id };
}

/** Keeps the current design: the candidate is deleted. */
export async function discardCandidate(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  designId: string,
) {
  await loadCandidate(deps, actor.teamId, studyId, designId);
  await deleteDesign(deps.db, { id: designId, teamId: actor.teamId, studyId });
}
