/**
 * One respondent's page: their taste profile row and their design-task choices task by task,
 * with the alternatives described by the version of the study they answered.
 */
import { getVersionById } from '../../../db/queries/versions';
import type { AppDeps } from '../../deps';
import { NotFoundError } from '../../lib/errors';
import { getRunProfile } from '../../../db/queries/taste-profiles';
import { listQuestionAnswers, listRespondentTaskAnswers } from '../../../db/queries/study-answers';
import type { Design } from '../../../shared/schemas/design';
import type { StudyDefinition } from '../../../shared/schemas/study-definition';
import type { RespondentChoice, RespondentProfile } from '../../../shared/schemas/tastes';
import { loadRunContext } from './run-context';
import { indexAnswers } from './background-answers';
import { toTasteRow } from './taste-rows';
import { describeLevels, getAlternativeLabel } from './alternative-labels';
import type { Actor } from '../actor';

export async function getRespondentProfile(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  runId: string,
  respondentId: string,
): Promise<RespondentProfile> {
  const ctx = await loadRunContext(deps, actor, studyId, runId);
  const profile = await getRunProfile(deps.db, { runId, studyId, respondentId });
  if (!profile) throw new NotFoundError('Respondent');
  const answers = indexAnswers(
    await listQuestionAnswers(deps.db, { studyId, respondentIds: [respondentId] }),
  );
  const version = await getVersionById(deps.db, { id: profile.versionId, studyId });
  const definition = (version?.definition ?? ctx.definition) as StudyDefinition;
  const design = (version?.design ?? ctx.design) as Design | null;
  const taskAnswers = await listRespondentTaskAnswers(deps.db, { studyId, respondentId });
  const fixed = definition.fixedAlternative;
  const choices: RespondentChoice[] = taskAnswers.map((a, i) => {
    const task = design?.tasks.find((t) => t.task === a.task);
    const alternatives: RespondentChoice['alternatives'] = (task?.alternatives ?? []).map(
      (alt, j) => ({
        index: j,
        label: getAlternativeLabel(definition, j),
        levels: describeLevels(definition, alt.levels),
        levelIds: alt.levels,
        fixed: false,
      }),
    );
    if (fixed)
      alternatives.push({
        index: -1,
        label: fixed.label,
        levels: fixed.kind === 'status_quo' ? describeLevels(definition, fixed.levels) : {},
        levelIds: fixed.kind === 'status_quo' ? fixed.levels : {},
        fixed: true,
      });
    return {
      task: a.task!,
      position: i + 1,
      alternatives,
      chosen: a.chosen,
      responseMs: a.responseMs,
    };
  });
  return {
    header: ctx.header,
    definition,
    row: toTasteRow(profile, ctx.header, answers.get(respondentId)),
    choices,
  };
}
