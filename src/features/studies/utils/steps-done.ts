/**
 * Which study sections carry a tick in the step bar: the set-up steps whose work exists.
 * Attributes and tasks when there are some; the questionnaire once saved (until then the
 * study shows a default one); the preview once both exist, since only then does it show the
 * whole survey as respondents will see it.
 */
import type { StudySection } from '@/config/paths';
import type { Study } from '@shared/schemas/study';
import { questionnaireSchema } from '@shared/schemas/questionnaire';

export function getStepsDone(study: Pick<Study, 'counts' | 'questionnaire'>): Set<StudySection> {
  const done = new Set<StudySection>();
  if (study.counts.attributes > 0) done.add('attributes');
  if (study.counts.tasks > 0) done.add('tasks');
  if (questionnaireSchema.safeParse(study.questionnaire).success) done.add('questionnaire');
  if (done.has('tasks') && done.has('questionnaire')) done.add('preview');
  return done;
}
