/**
 * What an answer becomes before it is stored, whichever path stores it: the screen it belongs
 * to, its row columns (choice tasks map the on-screen position back to the design), and the
 * status it leaves the session in (screened out, completed on the last screen). Pure: reads
 * only the frozen version and the respondent's screens.
 */
import type {
  AnswerValue,
  RespondentPlan,
  RespondentScreen,
  RespondentStatus,
} from '../../shared/schemas/respondent';
import type { FrozenVersion } from './respondent-screens';
import { pageOfScreen } from './respondent-screen-index';
import { repeatedTaskNumber } from './respondent-plan';
import { screensOut } from './answer-rules';

export type AnswerInput = {
  clientId: string;
  screenKey: string;
  value: AnswerValue;
  responseMs: number;
  /** How long ago the phone says the answer was given (late-answers.ts). */
  ageMs?: number;
};

/** Row columns of an answer: choice tasks map the on-screen position back to the design. */
export function answerColumnsFor(
  screen: RespondentScreen,
  value: AnswerValue,
  repeatOfTask: number | null,
) {
  if (screen.kind !== 'task' || value.kind !== 'choice')
    return { taskNumber: null, chosenAlternative: null, chosenPosition: null, value };
  const chosen = screen.alternatives[value.position];
  return {
    taskNumber: screen.taskKind === 'design' ? Number(screen.key.slice('task:'.length)) : null,
    chosenAlternative: chosen.index,
    chosenPosition: value.position,
    value: {
      ...value,
      taskKind: screen.taskKind,
      ...(screen.taskKind === 'dominance' ? { dominantChosen: chosen.index === 0 } : {}),
      ...(repeatOfTask !== null ? { repeatOfTask } : {}),
    },
  };
}

/**
 * The answer's row and the status it leaves the session in. `index` is the screen's place
 * among the respondent's screens (the caller has checked it exists and the value fits).
 */
export function shapeAnswer(
  version: FrozenVersion,
  respondent: {
    id: string;
    studyId: string;
    versionId: string;
    block: number;
    startedAt: Date;
  },
  seen: { plan: RespondentPlan; screens: RespondentScreen[]; index: number },
  answer: AnswerInput,
  now: Date,
) {
  const { plan, screens, index } = seen;
  const screen = screens[index];
  const page = pageOfScreen(version, screen.key);
  const repeatOf = page?.kind === 'repeat' ? repeatedTaskNumber(plan, page.repeatOf) : null;
  let status: RespondentStatus = 'in_progress';
  if (page && screensOut(page, answer.value)) status = 'screened_out';
  else if (index === screens.length - 1) status = 'completed';
  return {
    row: {
      respondentId: respondent.id,
      studyId: respondent.studyId,
      versionId: respondent.versionId,
      block: respondent.block,
      clientId: answer.clientId,
      screenKey: answer.screenKey,
      responseMs: answer.responseMs,
      createdAt: now,
      ...answerColumnsFor(screen, answer.value, repeatOf),
    },
    status: status as Exclude<RespondentStatus, 'over_quota'>,
    durationMs: now.getTime() - respondent.startedAt.getTime(),
  };
}
