/** Respondents (one per answering session) and what the respondent link needs to find. */
import { and, count, eq, inArray, sql } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { studies } from '../schema/studies';
import { invitees, respondents } from '../schema/fieldwork';

export const respondentColumns = {
  id: respondents.id,
  studyId: respondents.studyId,
  versionId: respondents.versionId,
  sessionToken: respondents.sessionToken,
  inviteeId: respondents.inviteeId,
  externalId: respondents.externalId,
  block: respondents.block,
  plan: respondents.plan,
  status: respondents.status,
  startedAt: respondents.startedAt,
  finishedAt: respondents.finishedAt,
  durationMs: respondents.durationMs,
};
export type RespondentRow = {
  [K in keyof typeof respondentColumns]: (typeof respondents.$inferSelect)[K];
};

/** The study a public link points to, whatever its status (the service decides what to show). */
export async function getStudyByPublicId(db: DbOrTx, params: { publicId: string }) {
  const [row] = await db
    .select({
      id: studies.id,
      teamId: studies.teamId,
      name: studies.name,
      publicTitle: studies.publicTitle,
      status: studies.status,
      settings: studies.settings,
      currentVersion: studies.currentVersion,
      archivedAt: studies.archivedAt,
    })
    .from(studies)
    .where(eq(studies.publicId, params.publicId));
  return row ?? null;
}

export async function getInviteeByToken(db: DbOrTx, params: { studyId: string; token: string }) {
  const [row] = await db
    .select({ id: invitees.id, externalId: invitees.externalId })
    .from(invitees)
    .where(and(eq(invitees.studyId, params.studyId), eq(invitees.token, params.token)));
  return row ?? null;
}

export async function insertRespondent(
  db: DbOrTx,
  params: {
    studyId: string;
    versionId: string;
    sessionToken: string;
    inviteeId?: string | null;
    externalId?: string | null;
    block: number;
    plan: unknown;
    device?: string;
    status?: 'in_progress' | 'completed' | 'screened_out' | 'over_quota';
    startedAt?: Date;
    simulatedTruth?: unknown;
  },
) {
  const [row] = await db.insert(respondents).values(params).returning(respondentColumns);
  return row as RespondentRow;
}

export async function getRespondentByToken(
  db: DbOrTx,
  params: { studyId: string; sessionToken: string; forUpdate?: boolean },
) {
  const q = db
    .select(respondentColumns)
    .from(respondents)
    .where(
      and(
        eq(respondents.studyId, params.studyId),
        eq(respondents.sessionToken, params.sessionToken),
      ),
    );
  const [row] = params.forUpdate ? await q.for('update') : await q;
  return (row as RespondentRow | undefined) ?? null;
}

export async function getRespondentByInvitee(
  db: DbOrTx,
  params: { studyId: string; inviteeId: string },
) {
  const [row] = await db
    .select(respondentColumns)
    .from(respondents)
    .where(
      and(eq(respondents.studyId, params.studyId), eq(respondents.inviteeId, params.inviteeId)),
    )
    .orderBy(sql`${respondents.startedAt} desc`)
    .limit(1);
  return (row as RespondentRow | undefined) ?? null;
}

export async function finishRespondent(
  db: DbOrTx,
  params: {
    id: string;
    status: 'completed' | 'screened_out' | 'over_quota';
    finishedAt: Date;
    durationMs: number;
  },
) {
  const [row] = await db
    .update(respondents)
    .set({ status: params.status, finishedAt: params.finishedAt, durationMs: params.durationMs })
    .where(eq(respondents.id, params.id))
    .returning(respondentColumns);
  return row as RespondentRow;
}

/** Respondents per block of one version who still count toward filling it. */
export async function countFillingByBlock(
  db: DbOrTx,
  params: { studyId: string; versionId: string },
) {
  const rows = await db
    .select({ block: respondents.block, n: count() })
    .from(respondents)
    .where(
      and(
        eq(respondents.studyId, params.studyId),
        eq(respondents.versionId, params.versionId),
        inArray(respondents.status, ['in_progress', 'completed']),
      ),
    )
    .groupBy(respondents.block);
  return new Map(rows.map((r) => [r.block, Number(r.n)]));
}

export async function countCompletes(db: DbOrTx, params: { studyId: string }) {
  const [row] = await db
    .select({ n: count() })
    .from(respondents)
    .where(and(eq(respondents.studyId, params.studyId), eq(respondents.status, 'completed')));
  return Number(row?.n ?? 0);
}

/** Serialises block assignment within one study (released at the end of the transaction). */
export async function lockStudyAssignment(db: DbOrTx, params: { studyId: string }) {
  await db.execute(sql`select pg_advisory_xact_lock(hashtext(${params.studyId}))`);
}

/** The respondent's own study (the id comes from their link), as answers need it. */
export async function getStudyForAnswers(db: DbOrTx, params: { id: string }) {
  const [row] = await db
    .select({
      id: studies.id,
      teamId: studies.teamId,
      status: studies.status,
      settings: studies.settings,
    })
    .from(studies)
    .where(eq(studies.id, params.id));
  return row ?? null;
}
