/**
 * The Responses section's use cases: the respondent table with automatic quality flags
 * (recomputed from the stored answers on every read, written back when they change), include /
 * exclude decisions kept for estimation, and the speeder threshold. Personal columns reach
 * only roles with personal:read.
 */
import type { AppDeps } from '../deps';
import { NotFoundError } from '../lib/errors';
import { toDeviceClass } from '../lib/device-class';
import { loadStudy } from './study-access';
import { recordAudit } from './audit';
import type { Actor } from './actor';
import { computeQualityFlags, readChoiceAnswer, type ChoiceAnswer } from './quality-flags';
import {
  excludeRespondentsWithFlags,
  listRespondentsForFlags,
  listResponses as queryResponses,
  setRespondentInclusion,
  updateQualitySettings,
  updateRespondentFlags,
} from '../../db/queries/responses';
import { listChoiceAnswers } from '../../db/queries/study-answers';
import { roleCan } from '../../shared/permissions';
import {
  qualityFlagKeys,
  qualityFlagsSchema,
  qualitySettingsSchema,
  type ExcludeFlaggedInput,
  type ListResponsesQuery,
  type QualityFlags,
  type QualitySettings,
  type ResponseList,
  type ResponsesSummary,
  type SetInclusionInput,
} from '../../shared/schemas/responses';

type Study = Awaited<ReturnType<typeof loadStudy>>;

export function readQualitySettings(settings: unknown): QualitySettings {
  const raw = (settings as { quality?: unknown } | null)?.quality ?? {};
  const parsed = qualitySettingsSchema.safeParse(raw);
  return parsed.success ? parsed.data : qualitySettingsSchema.parse({});
}

const unchecked: QualityFlags = {
  speeder: null,
  samePosition: null,
  alwaysFixed: null,
  dominanceFailed: null,
  inconsistent: null,
};

function readFlags(raw: unknown): QualityFlags {
  const parsed = qualityFlagsSchema.safeParse(raw);
  return parsed.success ? parsed.data : unchecked;
}

/** Rows never judged (flags still {}) count as changed, so every row gets its flags stored. */
const sameFlags = (stored: unknown, next: QualityFlags) => {
  const parsed = qualityFlagsSchema.safeParse(stored);
  return parsed.success && qualityFlagKeys.every((k) => parsed.data[k] === next[k]);
};

/** Recomputes every respondent's flags, stores the changed ones and summarises the study. */
export async function refreshQualityFlags(
  deps: AppDeps,
  study: Pick<Study, 'id' | 'definition' | 'settings'>,
): Promise<ResponsesSummary> {
  const settings = readQualitySettings(study.settings);
  const [people, choices] = await Promise.all([
    listRespondentsForFlags(deps.db, { studyId: study.id }),
    listChoiceAnswers(deps.db, { studyId: study.id }),
  ]);
  const byRespondent = new Map<string, ChoiceAnswer[]>();
  for (const c of choices) {
    // The flags judge on-screen positions: answers stored without one are not theirs to judge.
    if (c.chosenPosition === null) continue;
    const list = byRespondent.get(c.respondentId) ?? [];
    list.push(readChoiceAnswer(c));
    byRespondent.set(c.respondentId, list);
  }
  const hasFixedAlternative =
    (study.definition as { fixedAlternative?: unknown } | null)?.fixedAlternative != null;
  const result = computeQualityFlags(
    people.map((p) => ({ ...p, choices: byRespondent.get(p.id) ?? [] })),
    { speederFraction: settings.speederFraction, hasFixedAlternative },
  );
  const updates = people
    .map((p) => ({ id: p.id, before: p.flags, flags: result.flags.get(p.id)! }))
    .filter((u) => !sameFlags(u.before, u.flags));
  if (updates.length > 0) await updateRespondentFlags(deps.db, { studyId: study.id, updates });

  const flagged = Object.fromEntries(qualityFlagKeys.map((k) => [k, 0])) as Record<
    (typeof qualityFlagKeys)[number],
    number
  >;
  let anyFlag = 0;
  for (const p of people) {
    const f = result.flags.get(p.id)!;
    const keys = qualityFlagKeys.filter((k) => f[k] === true);
    keys.forEach((k) => flagged[k]++);
    if (keys.length > 0) anyFlag++;
  }
  const included = people.filter((p) => p.included).length;
  return {
    respondents: people.length,
    completed: people.filter((p) => p.status === 'completed').length,
    included,
    excluded: people.length - included,
    flagged,
    anyFlag,
    medianDurationMs: result.medianDurationMs,
    speederThresholdMs: result.speederThresholdMs,
  };
}

export async function listResponses(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  q: ListResponsesQuery,
): Promise<ResponseList> {
  const study = await loadStudy(deps, actor.teamId, studyId);
  const summary = await refreshQualityFlags(deps, study);
  const { rows, total } = await queryResponses(deps.db, {
    studyId,
    status: q.status,
    flags: q.flag === undefined ? undefined : q.flag === 'any' ? qualityFlagKeys : [q.flag],
    included: q.included === undefined ? undefined : q.included === 'true',
    language: q.language,
    sort: q.sort,
    order: q.order,
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  });
  const personalData = roleCan(actor.role, 'personal:read');
  return {
    items: rows.map(({ externalId, email, ...r }) => ({
      ...r,
      startedAt: r.startedAt.toISOString(),
      finishedAt: r.finishedAt?.toISOString() ?? null,
      flags: readFlags(r.flags),
      device: toDeviceClass(r.device),
      // Personal columns are left out entirely (not nulled) for roles without personal:read.
      ...(personalData ? { externalId, email } : {}),
    })),
    total,
    page: q.page,
    pageSize: q.pageSize,
    summary,
    settings: readQualitySettings(study.settings),
    personalData,
    languages: study.languages,
  };
}

export async function setInclusion(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  respondentId: string,
  input: SetInclusionInput,
) {
  const { teamId } = actor;
  await loadStudy(deps, teamId, studyId);
  const reason = input.included ? null : input.reason;
  await deps.db.transaction(async (tx) => {
    const row = await setRespondentInclusion(tx, {
      id: respondentId,
      studyId,
      included: input.included,
      reason,
    });
    if (!row) throw new NotFoundError('Respondent');
    // Respondents are named by the start of their random id: no personal data in the trail.
    await recordAudit(tx, {
      teamId,
      studyId,
      actor,
      action: input.included ? 'respondent.included' : 'respondent.excluded',
      targetType: 'respondent',
      targetId: respondentId,
      details: { respondent: respondentId.slice(0, 8), ...(reason ? { reason } : {}) },
    });
  });
  return { id: respondentId, included: input.included, exclusionReason: reason };
}

/** Bulk exclusion: flags are refreshed first, so the decision uses the current threshold. */
export async function excludeFlagged(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  input: ExcludeFlaggedInput,
) {
  const { teamId } = actor;
  const study = await loadStudy(deps, teamId, studyId);
  await refreshQualityFlags(deps, study);
  const excluded = await deps.db.transaction(async (tx) => {
    const count = await excludeRespondentsWithFlags(tx, {
      studyId,
      flags: input.flags,
      reason: input.reason,
    });
    await recordAudit(tx, {
      teamId,
      studyId,
      actor,
      action: 'respondent.flagged_excluded',
      details: { count, flags: input.flags, reason: input.reason },
    });
    return count;
  });
  return { excluded };
}

export async function saveQualitySettings(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  input: QualitySettings,
) {
  await loadStudy(deps, teamId, studyId);
  await updateQualitySettings(deps.db, { studyId, teamId, quality: input });
  const study = await loadStudy(deps, teamId, studyId);
  const summary = await refreshQualityFlags(deps, study);
  return { settings: readQualitySettings(study.settings), summary };
}
