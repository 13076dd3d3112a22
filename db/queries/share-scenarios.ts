/** Saved share scenarios of a study. Tenant: the team and the study in every where-clause. */
import { and, asc, eq } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { shareScenarios } from '../schema/shares';
import { users } from '../schema/accounts';

const columns = {
  id: shareScenarios.id,
  name: shareScenarios.name,
  alternatives: shareScenarios.alternatives,
  includeFixed: shareScenarios.includeFixed,
  createdAt: shareScenarios.createdAt,
  updatedAt: shareScenarios.updatedAt,
  createdBy: users.name,
};

export type ShareScenarioRow = {
  id: string;
  name: string;
  alternatives: unknown;
  includeFixed: boolean;
  createdAt: Date;
  updatedAt: Date;
  createdBy: string | null;
};

type Scope = { teamId: string; studyId: string };
/** One scenario of the team's study. */
const oneOf = (p: Scope & { id: string }) =>
  and(
    eq(shareScenarios.id, p.id),
    eq(shareScenarios.teamId, p.teamId),
    eq(shareScenarios.studyId, p.studyId),
  );

type Values = { name: string; alternatives: unknown; includeFixed: boolean };

export async function listShareScenarios(db: DbOrTx, p: Scope): Promise<ShareScenarioRow[]> {
  return db
    .select(columns)
    .from(shareScenarios)
    .leftJoin(users, eq(users.id, shareScenarios.createdBy))
    .where(and(eq(shareScenarios.teamId, p.teamId), eq(shareScenarios.studyId, p.studyId)))
    .orderBy(asc(shareScenarios.name));
}

export async function getShareScenario(
  db: DbOrTx,
  p: Scope & { id: string },
): Promise<ShareScenarioRow | null> {
  const [row] = await db
    .select(columns)
    .from(shareScenarios)
    .leftJoin(users, eq(users.id, shareScenarios.createdBy))
    .where(oneOf(p));
  return row ?? null;
}

export async function insertShareScenario(
  db: DbOrTx,
  p: Scope & Values & { createdBy: string },
): Promise<{ id: string }> {
  const [row] = await db
    .insert(shareScenarios)
    .values({
      teamId: p.teamId,
      studyId: p.studyId,
      name: p.name,
      alternatives: p.alternatives,
      includeFixed: p.includeFixed,
      createdBy: p.createdBy,
    })
    .returning({ id: shareScenarios.id });
  return row;
}

export async function updateShareScenario(
  db: DbOrTx,
  p: Scope & Values & { id: string },
): Promise<{ id: string } | null> {
  const [row] = await db
    .update(shareScenarios)
    .set({
      name: p.name,
      alternatives: p.alternatives,
      includeFixed: p.includeFixed,
      updatedAt: new Date(),
    })
    .where(oneOf(p))
    .returning({ id: shareScenarios.id });
  return row ?? null;
}

export async function deleteShareScenario(db: DbOrTx, p: Scope & { id: string }): Promise<boolean> {
  const rows = await db.delete(shareScenarios).where(oneOf(p)).returning({ id: shareScenarios.id });
  return rows.length > 0;
}
