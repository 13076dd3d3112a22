/**
 * Respondent sessions: what a link shows, starting or resuming a session (same browser by its
 * stored token, personal links by their invitee), and the session state the app walks through.
 * createRespondent is the one way respondents are made (the link, invitations and demo data).
 */
import { randomBytes, randomInt } from 'node:crypto';
import type { AppDeps } from '../deps';
import type { Db, DbOrTx } from '../../db/client';
import { keyedBatcherPer, type KeyedBatcherOptions } from '../lib/keyed-batcher';
import { AppError, NotFoundError } from '../lib/errors';
import { toDeviceClass } from '../lib/device-class';
import {
  getRespondentByToken,
  getStudyByPublicId,
  insertRespondent,
  insertStartedRespondents,
  type RespondentRow,
  type StartedRespondent,
} from '../../db/queries/respondents';
import { getLatestVersion, getLatestVersionId } from '../../db/queries/versions';
import { assignBlock, releaseBlock } from '../../db/queries/respondent-blocks';
import { listAnswerValues } from '../../db/queries/answers';
import { givenOnRevisable } from '../../shared/survey/going-back';
import type { FieldworkSettings } from '../../shared/schemas/study-lifecycle';
import {
  type RespondentPlan,
  type RespondentSession,
  type RespondentStatus,
  type SurveyLinkInfo,
} from '../../shared/schemas/respondent';
import { closeIfDue, dueCloseReason, readSettings } from './lifecycle';
import { createRespondentPlan } from './respondent-plan';
import { loadFrozenVersion } from './respondent-screens';
import { buildSurveyView } from './survey-view';
import { screensOfRespondent } from './respondent-screen-index';
import { rememberRespondent } from './known-respondents';
import { languageFromLink, localizeVersion, pageBeforeSession } from './respondent-language';

export type PublicStudy = NonNullable<Awaited<ReturnType<typeof getStudyByPublicId>>>;

/*
 * Session tokens are cut from a larger block of random bytes: one randomBytes call per token
 * cost the web process about 0.06 ms under a panel launch (bench:session-start profile), most
 * of it the call itself. The bytes are the same CSPRNG's output, each used once.
 */
const TOKEN_BYTES = 24;
let randomPool = Buffer.alloc(0);
let randomAt = 0;

export function createSessionToken(): string {
  if (randomAt + TOKEN_BYTES > randomPool.length) {
    randomPool = randomBytes(TOKEN_BYTES * 256);
    randomAt = 0;
  }
  const token = randomPool.toString('base64url', randomAt, randomAt + TOKEN_BYTES);
  randomPool.fill(0, randomAt, randomAt + TOKEN_BYTES);
  randomAt += TOKEN_BYTES;
  return token;
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
  return settlePublicStudy(deps, publicId, await getStudyByPublicId(deps.db, { publicId }), now);
}

/**
 * The study as a link shows it, from its row as just read: 404 when unknown or archived, and
 * closed first when its date or quota says so. `completes`: read with the row when it has a
 * quota of them (the session start's statement), else counted here.
 */
export async function settlePublicStudy(
  deps: AppDeps,
  publicId: string,
  study: PublicStudy | null,
  now: Date,
  completes?: number | null,
): Promise<PublicStudy> {
  if (!study || study.archivedAt)
    throw new AppError(404, 'survey_not_found', 'This survey link does not exist.');
  // Check without locking first: most links are opened while nothing is due.
  if (study.status === 'live' && (await dueCloseReason(deps.db, study, now, completes)))
    if (await closeIfDue(deps.db, study, now))
      return (await getStudyByPublicId(deps.db, { publicId }))!;
  return study;
}

export function linkState(study: PublicStudy): SurveyLinkInfo['state'] {
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
  const info: SurveyLinkInfo = {
    state,
    studyName: state === 'not_open' ? null : study.publicTitle,
    redirectUrl:
      state === 'over_quota'
        ? redirectFor(settings, 'over_quota', params[settings.panelParam] ?? null)
        : null,
    page: null,
  };
  if (state !== 'closed' && state !== 'over_quota') return info;
  // Only closed and full links get here, and each reads one row.
  const version = await getLatestVersion(deps.db, { studyId: study.id });
  const page = pageBeforeSession(version ?? {}, study.publicTitle, params.lang, {
    title: state === 'closed' ? 'ui.closed_title' : 'ui.over_quota_title',
    body: state === 'closed' ? 'ui.closed_body' : 'ui.over_quota_body',
  });
  return {
    ...info,
    studyName: page.studyName,
    page: { language: page.language, dir: page.dir, ...page.texts },
  };
}

export function assertOpen(study: PublicStudy): void {
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
 * A session start's respondent row, gathered with the other starts of the same turn of the
 * event loop and those that arrive while two such inserts are in flight (keyed-batcher.ts):
 * under a panel launch one statement and one commit make many respondents, where each start
 * used to wait for its own flush of the log. A unique index that refuses one row (a personal
 * link or panel id opened twice at once) sends every row of that batch again on its own, so
 * only that start sees the refusal.
 */
export const startedRespondentBatcherOf = keyedBatcherPer(
  (db: Db): KeyedBatcherOptions<StartedRespondent, RespondentRow> => ({
    maxBatch: 64,
    maxInFlight: 2,
    keyOf: (r) => r.sessionToken,
    runOne: (r) => insertRespondent(db, r),
    runBatch: (rows) => insertStartedRespondents(db, rows),
  }),
);

/**
 * Makes a respondent of the study's current version: a place in the least-filled block (an
 * atomic counter, no study-wide lock), a plan from a fresh seed, and a secret session token.
 */
export async function createRespondent(
  db: DbOrTx,
  params: {
    studyId: string;
    inviteeId?: string | null;
    externalId?: string | null;
    panelKey?: string | null;
    device?: string;
    /** The link's ?lang= (checked against the version's languages); the source when absent. */
    language?: string;
    seed?: number;
    startedAt?: Date;
    simulatedTruth?: unknown;
    /** db is the pool, not a transaction (lets the block counter skip the flush wait). */
    standalone?: boolean;
    /** The study's latest version when the caller has just read it (else it is read here). */
    latestVersionId?: string | null;
    /** A place the caller has already taken in that version's block counter (given back on failure). */
    block?: number | null;
  },
): Promise<{ respondent: RespondentRow; sessionToken: string; plan: RespondentPlan }> {
  const latestId =
    params.latestVersionId ?? (await getLatestVersionId(db, { studyId: params.studyId }))?.id;
  if (!latestId) throw new AppError(409, 'survey_not_open', 'This survey is not open yet.');
  // A place taken for a respondent that is not made is given back.
  let block = params.block ?? null;
  try {
    const version = await loadFrozenVersion(db, { id: latestId, studyId: params.studyId });
    const language = languageFromLink(version, params.language);
    block ??= await assignBlock(db, {
      versionId: version.id,
      blocks: version.design.blocks,
      standalone: params.standalone,
    });
    const plan = createRespondentPlan({
      ...version,
      block,
      seed: params.seed ?? randomInt(2 ** 31),
    });
    const sessionToken = createSessionToken();
    const row = {
      studyId: params.studyId,
      versionId: version.id,
      sessionToken,
      inviteeId: params.inviteeId ?? null,
      externalId: params.externalId ?? null,
      panelKey: params.panelKey ?? null,
      block,
      plan,
      // A coarse class only: the raw user agent can single a person out.
      device: toDeviceClass(params.device),
      language,
    };
    const respondent =
      params.standalone && !params.startedAt && params.simulatedTruth === undefined
        ? await startedRespondentBatcherOf(db as Db).submit(row)
        : await insertRespondent(db, {
            ...row,
            ...(params.startedAt ? { startedAt: params.startedAt } : {}),
            ...(params.simulatedTruth !== undefined
              ? { simulatedTruth: params.simulatedTruth }
              : {}),
          });
    return { respondent, sessionToken, plan };
  } catch (err) {
    if (block !== null) await releaseBlock(db, { versionId: latestId, block }).catch(() => {});
    throw err;
  }
}

export async function buildSession(
  db: DbOrTx,
  study: { id: string; publicTitle: string; status: string; settings: unknown },
  respondent: RespondentRow,
  /** isNew: just created (no answers to read); builtPlan: its plan as createRespondent made it. */
  opts: { isNew?: boolean; builtPlan?: RespondentPlan } = {},
): Promise<RespondentSession> {
  const source = await loadFrozenVersion(db, { id: respondent.versionId, studyId: study.id });
  const { screens, plan } = screensOfRespondent(source, respondent, opts.builtPlan);
  const local = localizeVersion(source, study.publicTitle, respondent.language);
  // The answer path keeps the source-language screens; the phone gets its language's.
  const survey =
    local.version === source
      ? buildSurveyView(source, plan, study.publicTitle, screens)
      : buildSurveyView(local.version, plan, local.title);
  const given = opts.isNew
    ? new Map<string, unknown>()
    : await listAnswerValues(db, { respondentId: respondent.id });
  return {
    sessionToken: respondent.sessionToken,
    ...survey,
    status: respondent.status,
    answered: survey.screens.filter((s) => given.has(s.key)).map((s) => s.key),
    redirectUrl: redirectFor(
      readSettings(study.settings),
      respondent.status,
      respondent.externalId,
    ),
    surveyOpen: study.status === 'live',
    given: givenOnRevisable(survey.screens, given, survey.back),
  };
}

export async function getSession(deps: AppDeps, publicId: string, sessionToken: string) {
  const study = await findPublicStudy(deps, publicId);
  const respondent = await getRespondentByToken(deps.db, { studyId: study.id, sessionToken });
  if (!respondent) throw new NotFoundError('Session');
  rememberRespondent(publicId, respondent);
  return buildSession(deps.db, study, respondent);
}
