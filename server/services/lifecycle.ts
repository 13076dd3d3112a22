/**
 * The study lifecycle: Draft → Live → Closed, reopen, back to draft. Going live checks the
 * study, then freezes definition, design and questionnaire into a version (a new one only when
 * something changed since the last). Closing happens by hand, at a date or at a quota of
 * completes (checked when a respondent completes and periodically).
 */
import type { AppDeps } from '../deps';
import type { Db, DbOrTx } from '../../db/client';
import { AppError, ConflictError } from '../lib/errors';
import {
  getDesignDocument,
  getLatestVersion,
  insertVersion,
  listLiveStudiesWithLimits,
  listVersionsWithCounts,
  lockStudy,
  updateStudyLifecycle,
  updateStudySettings,
} from '../../db/queries/versions';
import { countCompletes } from '../../db/queries/respondents';
import { countInvitees } from '../../db/queries/invitees';
import { loadStudy, lockStudyOrThrow } from './study-access';
import {
  fieldworkSettingsSchema,
  type ClosedReason,
  type FieldworkSettings,
  type Readiness,
  type StudyLifecycle,
  type StudyVersionSummary,
  type UpdateFieldworkSettingsInput,
} from '../../shared/schemas/study-lifecycle';
import { checkReadiness } from './readiness';
import { checkStaleTranslations } from './readiness-texts';
import { languagesOf, loadStudyDocuments } from './study-texts';
import { recordAudit } from './audit';
import type { Actor } from './actor';

type StudyRow = NonNullable<Awaited<ReturnType<typeof lockStudy>>>;

/*
 * Settings as read with a study row, validated once per row: a session start reads them three
 * times (closing date and quota, panel id, redirect), and each validation cost about 0.05 ms
 * of the web process's CPU (bench:session-start profile). Keyed by the row's own object, so a
 * row read again is validated again.
 */
const settingsOfRow = new WeakMap<object, FieldworkSettings>();

export function readSettings(raw: unknown): FieldworkSettings {
  const key = raw !== null && typeof raw === 'object' ? raw : null;
  const hit = key && settingsOfRow.get(key);
  if (hit) return hit;
  const parsed = fieldworkSettingsSchema.safeParse(raw ?? {});
  const settings = parsed.success ? parsed.data : fieldworkSettingsSchema.parse({});
  if (key) settingsOfRow.set(key, settings);
  return settings;
}

/** JSON with sorted keys: jsonb does not keep key order, so compare documents this way. */
function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`;
  if (value && typeof value === 'object')
    return `{${Object.keys(value)
      .sort()
      .map((k) => `${JSON.stringify(k)}:${canonical((value as Record<string, unknown>)[k])}`)
      .join(',')}}`;
  return JSON.stringify(value ?? null);
}

async function toLifecycle(db: DbOrTx, study: StudyRow): Promise<StudyLifecycle> {
  return {
    status: study.status,
    publicId: study.publicId,
    currentVersion: study.currentVersion,
    settings: readSettings(study.settings),
    completes: await countCompletes(db, { studyId: study.id }),
  };
}

async function readinessOf(db: DbOrTx, study: StudyRow, now: Date) {
  const design = study.currentDesignId
    ? await getDesignDocument(db, { id: study.currentDesignId, studyId: study.id })
    : null;
  const settings = readSettings(study.settings);
  const problems = checkReadiness({
    identifiability: {
      personalLinks: (await countInvitees(db, { studyId: study.id })).total > 0,
      panelIds: Object.values(settings.redirects).some((url) => url?.includes('{pid}') ?? false),
    },
    definition: study.definition,
    publicTitle: study.publicTitle,
    languages: { languages: study.languages, translations: study.translations },
    design: design?.design ?? null,
    questionnaire: study.questionnaire,
    settings,
    completes: await countCompletes(db, { studyId: study.id }),
    now,
  });
  return { problems, design: design?.design ?? null };
}

export async function getLifecycle(deps: AppDeps, teamId: string, studyId: string) {
  const study = await loadStudy(deps, teamId, studyId);
  return toLifecycle(deps.db, study);
}

export async function getReadiness(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  now = new Date(),
): Promise<Readiness> {
  const study = await loadStudy(deps, teamId, studyId);
  const { problems } = await readinessOf(deps.db, study, now);
  const warnings = checkStaleTranslations(
    await loadStudyDocuments(deps, study),
    languagesOf(study),
  );
  return { ready: problems.length === 0, problems, warnings };
}

export async function listVersions(
  deps: AppDeps,
  teamId: string,
  studyId: string,
): Promise<StudyVersionSummary[]> {
  await loadStudy(deps, teamId, studyId);
  const rows = await listVersionsWithCounts(deps.db, { studyId });
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() }));
}

/** A study imported from a file has no fieldwork: it never goes live or back to draft. */
function assertFielded(study: { source: string }): void {
  if (study.source === 'imported')
    throw new ConflictError(
      'study_imported',
      'This study was imported from a choice file: it has no fieldwork, so it cannot go live or become a draft.',
    );
}

/**
 * Draft or closed → live. Problems come back as a 422 listing every one of them. A new version
 * is frozen only when definition, design or questionnaire differ from the latest version.
 */
export async function goLive(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  opts: { from?: 'draft' | 'closed'; now?: Date; actor?: Actor | null } = {},
): Promise<StudyLifecycle> {
  const now = opts.now ?? new Date();
  return deps.db.transaction(async (tx) => {
    const study = await lockStudyOrThrow(tx, teamId, studyId);
    if (study.status === 'live')
      throw new ConflictError('already_live', 'The study is already live.');
    assertFielded(study);
    if (opts.from && study.status !== opts.from)
      throw new ConflictError(
        'wrong_status',
        `Only a ${opts.from} study can do this; this one is ${study.status}.`,
      );
    const { problems, design } = await readinessOf(tx, study, now);
    if (problems.length > 0)
      throw new AppError(
        422,
        'not_ready',
        `The study cannot go live yet: ${problems.length} problem${problems.length === 1 ? '' : 's'} to fix.`,
        problems.map((p) => ({ path: p.path, message: p.message })),
      );
    const frozen = {
      definition: study.definition,
      design,
      questionnaire: study.questionnaire,
      languages: study.languages,
      translations: study.translations,
    };
    const latest = await getLatestVersion(tx, { studyId });
    const unchanged =
      latest &&
      canonical({
        definition: latest.definition,
        design: latest.design,
        questionnaire: latest.questionnaire,
        languages: latest.languages,
        translations: latest.translations,
      }) === canonical(frozen);
    const version = unchanged ? latest.version : (latest?.version ?? 0) + 1;
    if (!unchanged) await insertVersion(tx, { studyId, version, ...frozen });
    const settings = { ...readSettings(study.settings), closedReason: null, closedAt: null };
    const updated = await updateStudyLifecycle(tx, {
      id: studyId,
      teamId,
      status: 'live',
      settings,
      currentVersion: version,
    });
    await recordAudit(tx, {
      teamId,
      studyId,
      actor: opts.actor,
      action: study.status === 'closed' ? 'study.reopened' : 'study.went_live',
      details: { study: study.name, version, newVersion: !unchanged },
    });
    return toLifecycle(tx, updated!);
  });
}

/** Closes a live study inside the caller's transaction (the study row must be locked). */
export async function closeLockedStudy(
  tx: DbOrTx,
  study: StudyRow,
  reason: ClosedReason,
  now: Date,
  actor: Actor | null = null,
) {
  const settings = {
    ...readSettings(study.settings),
    closedReason: reason,
    closedAt: now.toISOString(),
  };
  await recordAudit(tx, {
    teamId: study.teamId,
    studyId: study.id,
    actor,
    action: 'study.closed',
    details: { study: study.name, reason },
  });
  return updateStudyLifecycle(tx, {
    id: study.id,
    teamId: study.teamId,
    status: 'closed',
    settings,
  });
}

export async function closeStudy(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  now = new Date(),
  actor: Actor | null = null,
) {
  return deps.db.transaction(async (tx) => {
    const study = await lockStudyOrThrow(tx, teamId, studyId);
    if (study.status !== 'live')
      throw new ConflictError('not_live', 'Only a live study can be closed.');
    return toLifecycle(tx, (await closeLockedStudy(tx, study, 'manual', now, actor))!);
  });
}

/** Closed → draft, so the definition, design and questionnaire can change (a new version at go-live). */
export async function returnToDraft(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  actor: Actor | null = null,
) {
  return deps.db.transaction(async (tx) => {
    const study = await lockStudyOrThrow(tx, teamId, studyId);
    if (study.status !== 'closed')
      throw new ConflictError('not_closed', 'Close the study before editing it again.');
    assertFielded(study);
    const updated = await updateStudyLifecycle(tx, {
      id: studyId,
      teamId,
      status: 'draft',
      settings: readSettings(study.settings),
    });
    await recordAudit(tx, {
      teamId,
      studyId,
      actor,
      action: 'study.returned_to_draft',
      details: { study: study.name },
    });
    return toLifecycle(tx, updated!);
  });
}

export async function updateSettings(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  input: UpdateFieldworkSettingsInput,
) {
  return deps.db.transaction(async (tx) => {
    const study = await lockStudyOrThrow(tx, teamId, studyId);
    const current = readSettings(study.settings);
    const next = fieldworkSettingsSchema.parse({
      ...current,
      ...input,
      redirects: { ...current.redirects, ...(input.redirects ?? {}) },
    });
    const updated = await updateStudySettings(tx, { id: studyId, teamId, settings: next });
    return toLifecycle(tx, updated!);
  });
}

/** Why a live study should close now, or null; `completes` when the caller has just counted them. */
export async function dueCloseReason(
  db: DbOrTx,
  study: { id: string; settings: unknown },
  now: Date,
  completes?: number | null,
): Promise<ClosedReason | null> {
  const { closeAt, quotaCompletes } = readSettings(study.settings);
  if (closeAt && new Date(closeAt) <= now) return 'date';
  if (
    quotaCompletes !== null &&
    (completes ?? (await countCompletes(db, { studyId: study.id }))) >= quotaCompletes
  )
    return 'quota';
  return null;
}

/** Closes the study when its date or quota says so; returns the (possibly new) status. */
export async function closeIfDue(
  db: Db,
  study: { id: string; teamId: string },
  now = new Date(),
): Promise<ClosedReason | null> {
  return db.transaction(async (tx) => {
    const locked = await lockStudy(tx, study);
    if (!locked || locked.status !== 'live') return null;
    const reason = await dueCloseReason(tx, locked, now);
    if (reason) await closeLockedStudy(tx, locked, reason, now);
    return reason;
  });
}

/** The periodic check: closes every live study whose date has passed or quota is full. */
export async function closeDueStudies(deps: AppDeps, now = new Date()): Promise<number> {
  let closed = 0;
  for (const s of await listLiveStudiesWithLimits(deps.db))
    if (await closeIfDue(deps.db, s, now)) closed++;
  return closed;
}

/** Runs the close check every `intervalMs` (a minute by default); returns a stop function. */
export function startCloseCheck(deps: AppDeps, intervalMs = 60_000): () => void {
  const timer = setInterval(() => {
    closeDueStudies(deps).catch((err) => deps.logger.error({ err }, 'close check failed'));
  }, intervalMs);
  timer.unref();
  return () => clearInterval(timer);
}
