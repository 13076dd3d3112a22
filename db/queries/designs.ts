/**
 * Designs attached to studies (generated, imported or copied). Tenant: the team in every where-
 * clause; an insert carries the team.
 */
import { and, eq } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { designs } from '../schema/studies';
import { updateStudy } from './studies';

export const designColumns = {
  id: designs.id,
  studyId: designs.studyId,
  teamId: designs.teamId,
  method: designs.method,
  spec: designs.spec,
  design: designs.design,
  diagnostics: designs.diagnostics,
  createdAt: designs.createdAt,
};

export async function getDesignById(db: DbOrTx, params: { id: string; teamId: string }) {
  const [row] = await db
    .select(designColumns)
    .from(designs)
    .where(and(eq(designs.id, params.id), eq(designs.teamId, params.teamId)));
  return row ?? null;
}

export async function insertDesign(
  db: DbOrTx,
  params: {
    studyId: string;
    teamId: string;
    method: string;
    spec: unknown;
    design: unknown;
    diagnostics: unknown;
    createdBy: string | null;
  },
) {
  const [row] = await db.insert(designs).values(params).returning(designColumns);
  return row;
}

/** Inserts a design and makes it its study's current one (run it in the caller's transaction). */
export async function insertCurrentDesign(db: DbOrTx, params: Parameters<typeof insertDesign>[1]) {
  const row = await insertDesign(db, params);
  await updateStudy(db, {
    id: params.studyId,
    teamId: params.teamId,
    set: { currentDesignId: row.id },
  });
  return row;
}

/** Deletes a design of the study that is not its current one (a discarded candidate). */
export async function deleteDesign(
  db: DbOrTx,
  params: { id: string; teamId: string; studyId: string },
) {
  const [row] = await db
    .delete(designs)
    .where(
      and(
        eq(designs.id, params.id),
        eq(designs.teamId, params.teamId),
        eq(designs.studyId, params.studyId),
      ),
    )
    .returning({ id: designs.id });
  return row ?? null;
}
