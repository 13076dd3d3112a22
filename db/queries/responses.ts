/**
 * Respondents as the Responses section sees them: their choice answers for the quality flags,
 * the paged table, inclusion decisions, and the study's quality settings (a key of its own in
 * studies.settings, merged so other settings are never overwritten). Tenant: the study is in
 * every where-clause (and the team where a study row is written); the caller has loaded the
 * study for the team. The demo seed's functions are called by the seed only.
 */
import { and, asc, count, desc, eq, isNotNull, or, sql, type SQL } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { invitees, respondents } from '../schema/fieldwork';
import { studies, studyVersions } from '../schema/studies';
import type { QualityFlagKey, QualityFlags } from '../../shared/schemas/responses';

export async function listRespondentsForFlags(db: DbOrTx, params: { studyId: string }) {
  return db
    .select({
      id: respondents.id,
      status: respondents.status,
      durationMs: respondents.durationMs,
      included: respondents.included,
      flags: respondents.flags,
    })
    .from(respondents)
    .where(eq(respondents.studyId, params.studyId));
}

/** Writes changed flags in one statement. */
export async function updateRespondentFlags(
  db: DbOrTx,
  params: { studyId: string; updates: Array<{ id: string; flags: QualityFlags }> },
) {
  for (let i = 0; i < params.updates.length; i += 1000) {
    const chunk = params.updates.slice(i, i + 1000);
    const values = sql.join(
      chunk.map((u) => sql`(${u.id}::uuid, ${JSON.stringify(u.flags)}::jsonb)`),
      sql`, `,
    );
    await db.execute(sql`
      update ${respondents} set flags = v.flags
      from (values ${values}) as v(id, flags)
      where ${respondents.id} = v.id and ${respondents.studyId} = ${params.studyId}`);
  }
}

const flagIs = (key: QualityFlagKey) => sql`(${respondents.flags}->>${key}) = 'true'`;

function anyFlagCondition(keys: readonly QualityFlagKey[]): SQL {
  return or(...keys.map(flagIs))!;
}

export async function listResponses(
  db: DbOrTx,
  params: {
    studyId: string;
    status?: 'in_progress' | 'completed' | 'screened_out' | 'over_quota';
    flags?: readonly QualityFlagKey[];
    included?: boolean;
    language?: string;
    sort: 'started' | 'duration';
    order: 'asc' | 'desc';
    limit: number;
    offset: number;
  },
) {
  const where = and(
    eq(respondents.studyId, params.studyId),
    params.status ? eq(respondents.status, params.status) : undefined,
    params.flags ? anyFlagCondition(params.flags) : undefined,
    params.included !== undefined ? eq(respondents.included, params.included) : undefined,
    params.language ? eq(respondents.language, params.language) : undefined,
  );
  const dir = params.order === 'asc' ? asc : desc;
  const orderBy =
    params.sort === 'duration'
      ? [sql`${respondents.durationMs} ${sql.raw(params.order)} nulls last`, asc(respondents.id)]
      : [dir(respondents.startedAt), asc(respondents.id)];
  const [rows, [{ n }]] = await Promise.all([
    db
      .select({
        id: respondents.id,
        status: respondents.status,
        version: studyVersions.version,
        block: respondents.block,
        startedAt: respondents.startedAt,
        finishedAt: respondents.finishedAt,
        durationMs: respondents.durationMs,
        flags: respondents.flags,
        included: respondents.included,
        exclusionReason: respondents.exclusionReason,
        device: respondents.device,
        language: respondents.language,
        externalId: respondents.externalId,
        email: invitees.email,
      })
      .from(respondents)
      .innerJoin(studyVersions, eq(studyVersions.id, respondents.versionId))
      .leftJoin(invitees, eq(invitees.id, respondents.inviteeId))
      .where(where)
      .orderBy(...orderBy)
      .limit(params.limit)
      .offset(params.offset),
    db.select({ n: count() }).from(respondents).where(where),
  ]);
  return { rows, total: Number(n) };
}

export async function setRespondentInclusion(
  db: DbOrTx,
  params: { id: string; studyId: string; included: boolean; reason: string | null },
) {
  const [row] = await db
    .update(respondents)
    .set({ included: params.included, exclusionReason: params.reason })
    .where(and(eq(respondents.id, params.id), eq(respondents.studyId, params.studyId)))
    .returning({ id: respondents.id });
  return row ?? null;
}

/** Excludes every still-included respondent carrying one of the flags. */
export async function excludeRespondentsWithFlags(
  db: DbOrTx,
  params: { studyId: string; flags: readonly QualityFlagKey[]; reason: string },
) {
  const rows = await db
    .update(respondents)
    .set({ included: false, exclusionReason: params.reason })
    .where(
      and(
        eq(respondents.studyId, params.studyId),
        eq(respondents.included, true),
        anyFlagCondition(params.flags),
      ),
    )
    .returning({ id: respondents.id });
  return rows.length;
}

/** Sets settings.quality, keeping every other key of the settings document. */
export async function updateQualitySettings(
  db: DbOrTx,
  params: { studyId: string; teamId: string; quality: object },
) {
  await db
    .update(studies)
    .set({
      settings: sql`coalesce(${studies.settings}, '{}'::jsonb) || jsonb_build_object('quality', ${JSON.stringify(params.quality)}::jsonb)`,
    })
    .where(and(eq(studies.id, params.studyId), eq(studies.teamId, params.teamId)));
}

/** The demo seed: synthetic respondents are the ones carrying a simulated truth. */
export async function countSimulatedRespondents(db: DbOrTx, params: { studyId: string }) {
  return db.$count(
    respondents,
    and(eq(respondents.studyId, params.studyId), isNotNull(respondents.simulatedTruth)),
  );
}

export async function deleteSimulatedRespondents(db: DbOrTx, params: { studyId: string }) {
  await db
    .delete(respondents)
    .where(and(eq(respondents.studyId, params.studyId), isNotNull(respondents.simulatedTruth)));
}

export async function getStudyForSeed(db: DbOrTx, params: { studyId: string }) {
  const [row] = await db
    .select({
      id: studies.id,
      teamId: studies.teamId,
      status: studies.status,
      definition: studies.definition,
      questionnaire: studies.questionnaire,
    })
    .from(studies)
    .where(eq(studies.id, params.studyId));
  return row ?? null;
}
