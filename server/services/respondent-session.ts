/**
 * Respondent sessions: what a link shows, starting or resuming a session (same browser by its
 * stored token, personal links by their invitee), and the session state the app walks through.
 * createRespondent is the one way respondents are made (the link, invitations and demo data).
 */
import { randomBytes, randomInt } from 'node:crypto';
import type { AppDeps } from '../deps';
import type { DbOrTx } from '../../db/client';
import { AppError, NotFoundError } from '../lib/errors';
import {
  countFillingByBlock,
  getInviteeByToken,
  getRespondentByInvitee,
  getRespondentByToken,
  getStudyByPublicId,
  insertRespondent,
  lockStudyAssignment,
  type RespondentRow,
} from '../../db/queries/respondents';
import { getLatestVersion } from '../../db/queries/versions';
import { listAnsweredKeys } from '../../db/queries/answers';
import type { FieldworkSettings } from '../../shared/schemas/study-lifecycle';
import {
  respondentPlanSchema,
  type RespondentSession,
  type RespondentStatus,
  type StartSessionInput,
  type SurveyLinkInfo,
} from '../../shared/schemas/respondent';
import { closeIfDue, dueCloseReason, readSettings } from './lifecycle';
import { chooseLeastFilledBlock, createRespondentPlan } from './respondent-plan';
import { buildScreens, endPageOf, loadFrozenVersion } from './respondent-screens';

type PublicStudy = NonNullable<Awaited<ReturnType<typeof getStudyByPublicId>>>;

export function createSessionToken(): string {
  return randomBytes(24).toString('base64url');
}

/** The panel redirect for a finished respondent, with {pid} replaced by their external id. */
export function redirectFor(
  settings: FieldworkSettings,
  status: RespondentStatus,
  externalId: string | null,
): string | null {
  const template =
    status === 'completed'
      ? settings.redirects.complete
      : status === 'screened_out'
        ? settings.redirects.screenedOut
        : status === 'over_quota'
          ? settings.redirects.overQuota
          : null;
  return template ? template.replaceAll('{pid}', encodeURIComponent(externalId ?? '')) : null;
}

/** The study behind a public link; unknown and archived links are 404 (never another study). */
export async function findPublicStudy(deps: AppDeps, publicId: string, now = new Date()) {
  const study = await getStudyByPublicId(deps.db, { publicId });
  if (!study || study.archivedAt)
    throw new AppError(404, 'survey_not_found', 'This survey link does not exist.');
  // Check without locking first: most links are opened while nothing is due.
  if (study.status === 'live' && (await dueCloseReason(deps.db, study, now)))
    if (await closeIfDue(deps.db, study, now))
      return (await getStudyByPublicId(deps.db, { publicId }))!;
  return study;
}

function linkState(study: PublicStudy): SurveyLinkInfo['state'] {
  if (study.status === 'live') return 'live';
  if (study.status === 'draft') return 'not_open';
  return readSettings(study.settings).closedReason === 'quota' ? 'over_quota' : 'closed';
}

export async function getLinkInfo(
  deps: AppDeps,
  publicId: string,
  params: Record<string, string>,
): Promise<SurveyLinkInfo> {
  const study = await findPublicStudy(deps, publicId);
  const state = linkState(study);
  const settings = readSettings(study.settings);
  return {
    state,
    studyName: state === 'not_open' ? null : study.publicTitle,
    redirectUrl:
      state === 'over_quota'
        ? redirectFor(settings, 'over_quota', params[settings.panelParam] ?? null)
        : null,
  };
}

function assertOpen(study: PublicStudy): void {
  const state = linkState(study);
  if (state === 'not_open')
    throw new AppError(409, 'survey_not_open', 'This survey is not open yet.');
  if (state === 'over_quota')
    throw new AppError(
      410,
      'over_quota',
      'This survey has all the answers it needs. Thank you for your interest.',
    );
  if (state === 'closed')
    throw new AppError(
      410,
      'survey_closed',
      'This survey has closed. Thank you for your interest.',
    );
}

/**
 * Makes a respondent of the study's current version: the least-filled block (assignment is
 * serialised per study), a plan from a fresh seed, and a secret session token.
 */
export async function createRespondent(
  db: DbOrTx,
  params: {
    studyId: string;
    inviteeId?: string | null;
    externalId?: string | null;
    device?: string;
    seed?: number;
    startedAt?: Date;
    simulatedTruth?: unknown;
  },
): Promise<{ respondent: RespondentRow; sessionToken: string }> {
  const run = async (tx: DbOrTx) => {
    await lockStudyAssignment(tx, { studyId: params.studyId });
    const latest = await getLatestVersion(tx, { studyId: params.studyId });
    if (!latest) throw new AppError(409, 'survey_not_open', 'This survey is not open yet.');
    const version = await loadFrozenVersion(tx, { id: latest.id, studyId: params.studyId });
    const filled = await countFillingByBlock(tx, {
      studyId: params.studyId,
      versionId: version.id,
    });
    const block = chooseLeastFilledBlock(version.design.blocks, filled);
    const plan = createRespondentPlan({
      ...version,
      block,
      seed: params.seed ?? randomInt(2 ** 31),
    });
    const sessionToken = createSessionToken();
    const respondent = await insertRespondent(tx, {
      studyId: params.studyId,
      versionId: version.id,
      sessionToken,
      inviteeId: params.inviteeId ?? null,
      externalId: params.externalId ?? null,
      block,
      plan,
      device: (params.device ?? '').slice(0, 200),
      ...(params.startedAt ? { startedAt: params.startedAt } : {}),
      ...(params.simulatedTruth !== undefined ? { simulatedTruth: params.simulatedTruth } : {}),
    });
    return { respondent, sessionToken };
  };
  return db.transaction(run);
}

export async function buildSession(
  db: DbOrTx,
  study: { id: string; publicTitle: string; status: string; settings: unknown },
  respondent: RespondentRow,
): Promise<RespondentSession> {
  const version = await loadFrozenVersion(db, { id: respondent.versionId, studyId: study.id });
  const plan = respondentPlanSchema.parse(respondent.plan);
  const screens = buildScreens(version, plan);
  const answeredKeys = await listAnsweredKeys(db, { respondentId: respondent.id });
  const { attributes, alternatives, fixedAlternative } = version.definition;
  return {
    sessionToken: respondent.sessionToken,
    studyName: study.publicTitle,
    status: respondent.status,
    definition: { attributes, alternatives, fixedAlternative },
    screens,
    answered: screens.filter((s) => answeredKeys.has(s.key)).map((s) => s.key),
    end: endPageOf(version.questionnaire),
    redirectUrl: redirectFor(
      readSettings(study.settings),
      respondent.status,
      respondent.externalId,
    ),
    surveyOpen: study.status === 'live',
    back: {
      allowBack: version.questionnaire.options.allowBack,
      backOnTasks: version.questionnaire.options.backOnTasks,
    },
  };
}

/**
 * Starts a session or resumes one: this browser's earlier token, else the personal link's
 * respondent, else a new respondent (with the panel id from the link as external id).
 */
export async function startSession(
  deps: AppDeps,
  publicId: string,
  input: Required<Pick<StartSessionInput, 'params' | 'device'>> & { sessionToken?: string },
): Promise<RespondentSession> {
  const study = await findPublicStudy(deps, publicId);
  assertOpen(study);
  if (input.sessionToken) {
    const mine = await getRespondentByToken(deps.db, {
      studyId: study.id,
      sessionToken: input.sessionToken,
    });
    if (mine) return buildSession(deps.db, study, mine);
  }
  const settings = readSettings(study.settings);
  let invitee: { id: string; externalId: string | null } | null = null;
  const inviteToken = input.params.inv;
  if (inviteToken) {
    invitee = await getInviteeByToken(deps.db, { studyId: study.id, token: inviteToken });
    if (!invitee)
      throw new AppError(
        404,
        'invitation_not_found',
        'This personal link is not valid for this survey.',
      );
    const earlier = await getRespondentByInvitee(deps.db, {
      studyId: study.id,
      inviteeId: invitee.id,
    });
    if (earlier) return buildSession(deps.db, study, earlier);
  }
  const { respondent } = await createRespondent(deps.db, {
    studyId: study.id,
    inviteeId: invitee?.id ?? null,
    externalId: input.params[settings.panelParam] ?? invitee?.externalId ?? null,
    device: input.device,
  });
  return buildSession(deps.db, study, respondent);
}

export async function getSession(deps: AppDeps, publicId: string, sessionToken: string) {
  const study = await findPublicStudy(deps, publicId);
  const respondent = await getRespondentByToken(deps.db, { studyId: study.id, sessionToken });
  if (!respondent) throw new NotFoundError('Session');
  return buildSession(deps.db, study, respondent);
}
