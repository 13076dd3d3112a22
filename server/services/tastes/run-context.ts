/**
 * What every Tastes, Shares and Exports use case starts from: the study, one of its finished
 * runs, the frozen definition, design and questionnaire, and the table header (coefficients
 * with their labels and population moments, WTP columns, background questions the caller may
 * see, design tasks).
 */
import type { AppDeps } from '../../deps';
import { ConflictError, NotFoundError } from '../../lib/errors';
import { loadStudy } from '../study-access';
import { countRunProfiles } from '../../../db/queries/taste-profiles';
import { getRunById } from '../../../db/queries/runs';
import { getLatestVersion } from '../../../db/queries/versions';
import { roleCan } from '../../../shared/permissions';
import type { RunResult } from '../../../shared/schemas/run';
import type { EstimationSpec } from '../../../shared/schemas/estimation-spec';
import type { ModelFamily } from '../../../shared/schemas/estimation-families';
import type { StudyDefinition } from '../../../shared/schemas/study-definition';
import type { Design } from '../../../shared/schemas/design';
import { LOW_EFFECTIVE_DRAWS, type TasteHeader } from '../../../shared/schemas/tastes';
import { getBackgroundQuestions } from './background-answers';
import { getWtpUnavailableReason } from '../exports/estimate-tables';
import type { Actor } from '../actor';

export type RunContext = Awaited<ReturnType<typeof loadRunContext>>;

/** Loads the run (404 outside the team or study; 409 until it is done) and its header. */
export async function loadRunContext(deps: AppDeps, actor: Actor, studyId: string, runId: string) {
  const study = await loadStudy(deps, actor.teamId, studyId);
  const run = await getRunById(deps.db, { id: runId, teamId: actor.teamId, studyId });
  if (!run) throw new NotFoundError('Run');
  if (run.status !== 'done' || !run.results)
    throw new ConflictError(
      'run_not_finished',
      `This run is ${run.status}; choose a finished run.`,
    );
  const version = await getLatestVersion(deps.db, { studyId });
  const definition = (version?.definition ?? study.definition) as StudyDefinition;
  const design = (version?.design ?? null) as Design | null;
  const results = run.results as RunResult;
  const spec = run.spec as EstimationSpec;
  const personal = roleCan(actor.role, 'personal:read');
  const profiles = await countRunProfiles(deps.db, { runId });
  const labelOf = (name: string) =>
    results.columns?.find((c) => c.coefficient === name)?.label ?? name;
  const costAttribute = definition.attributes.find((a) => a.isCost);
  const header: TasteHeader = {
    run: {
      id: run.id,
      name: run.name,
      model: run.model as ModelFamily,
      finishedAt: run.finishedAt?.toISOString() ?? null,
      profiles,
      profileDraws: results.profileDraws?.count ?? null,
      erasedRespondents: run.erasedRespondents,
      wtpUnavailable: getWtpUnavailableReason(spec, results),
    },
    coefficients: results.population.map((p) => ({
      name: p.name,
      label: labelOf(p.name),
      distribution: p.distribution,
      populationMean: p.mean,
      populationSd: p.sd,
      location: p.location,
      spread: p.spread,
    })),
    wtp: spec.cost ? spec.coefficients.map((c) => c.name).filter((n) => n !== spec.cost) : [],
    cost: spec.cost ?? null,
    costUnit: costAttribute?.unit ?? '',
    questions: getBackgroundQuestions(version?.questionnaire ?? study.questionnaire).filter(
      (q) => personal || !q.personal,
    ),
    tasks: (design?.tasks ?? []).map((t) => ({ task: t.task, block: t.block })),
    personalColumns: personal,
    // A latent class profile's "effective draws" is its effective number of classes: no flag.
    lowDrawsThreshold: run.model === 'latent_class' ? 0 : LOW_EFFECTIVE_DRAWS,
  };
  return { study, run, results, spec, definition, design, version, header, personal };
}
