/** Studies. Tenant: the team in every where-clause. */
import { and, desc, eq, isNotNull, isNull, sql } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { studies } from '../schema/studies';

export const studyColumns = {
  id: studies.id,
  teamId: studies.teamId,
  publicId: studies.publicId,
  name: studies.name,
  publicTitle: studies.publicTitle,
  description: studies.description,
  status: studies.status,
  source: studies.source,
  definition: studies.definition,
  questionnaire: studies.questionnaire,
  settings: studies.settings,
  languages: studies.languages,
  translations: studies.translations,
  translationSources: studies.translationSources,
  currentDesignId: studies.currentDesignId,
  currentVersion: studies.currentVersion,
  archivedAt: studies.archivedAt,
  createdAt: studies.createdAt,
  updatedAt: studies.updatedAt,
};

/** The tenant is part of every look-up: a study id from another team finds nothing. */
export async function getStudyById(db: DbOrTx, params: { id: string; teamId: string }) {
  const [row] = await db
    .select(studyColumns)
    .from(studies)
    .where(and(eq(studies.id, params.id), eq(studies.teamId, params.teamId)));
  return row ?? null;
}

/**
 * Counts shown in the studies list, computed in SQL so the list stays one query. Outer
 * columns are written fully qualified: unqualified names inside the subqueries would bind
 * to the inner tables (respondents also has an "id").
 */
const outer = (column: string) => sql.raw(`"studies"."${column}"`);
const designTasks = sql<number>`coalesce((select jsonb_array_length(d.design->'tasks') from designs d where d.id = ${outer('current_design_id')}), 0)`;
const designBlocks = sql<number>`coalesce((select (d.design->>'blocks')::int from designs d where d.id = ${outer('current_design_id')}), 0)`;
const attributeCount = sql<number>`coalesce(jsonb_array_length(${outer('definition')}->'attributes'), 0)`;
const completedRespondents = sql<number>`(select count(*)::int from respondents r where r.study_id = ${outer('id')} and r.status = 'completed')`;

export const studyCountColumns = {
  attributeCount: attributeCount.mapWith(Number),
  taskCount: designTasks.mapWith(Number),
  blockCount: designBlocks.mapWith(Number),
  respondentCount: completedRespondents.mapWith(Number),
};

export async function listStudies(db: DbOrTx, params: { teamId: string; archived: boolean }) {
  return db
    .select({ ...studyColumns, ...studyCountColumns })
    .from(studies)
    .where(
      and(
        eq(studies.teamId, params.teamId),
        params.archived ? isNotNull(studies.archivedAt) : isNull(studies.archivedAt),
      ),
    )
    .orderBy(desc(studies.updatedAt));
}

export async function getStudyWithCounts(db: DbOrTx, params: { id: string; teamId: string }) {
  const [row] = await db
    .select({ ...studyColumns, ...studyCountColumns })
    .from(studies)
    .where(and(eq(studies.id, params.id), eq(studies.teamId, params.teamId)));
  return row ?? null;
}

export async function insertStudy(
  db: DbOrTx,
  params: {
    teamId: string;
    publicId: string;
    name: string;
    publicTitle: string;
    description: string;
    definition: unknown;
    questionnaire?: unknown;
    languages?: string[];
    translations?: Record<string, Record<string, string>>;
    translationSources?: Record<string, Record<string, string>>;
    createdBy: string | null;
  },
) {
  const [row] = await db
    .insert(studies)
    .values({
      teamId: params.teamId,
      publicId: params.publicId,
      name: params.name,
      publicTitle: params.publicTitle,
      description: params.description,
      definition: params.definition,
      questionnaire: params.questionnaire ?? {},
      ...(params.languages ? { languages: params.languages } : {}),
      ...(params.translations ? { translations: params.translations } : {}),
      ...(params.translationSources ? { translationSources: params.translationSources } : {}),
      createdBy: params.createdBy,
    })
    .returning(studyColumns);
  return row;
}

export async function updateStudy(
  db: DbOrTx,
  params: {
    id: string;
    teamId: string;
    set: Partial<{
      name: string;
      publicTitle: string;
      description: string;
      definition: unknown;
      currentDesignId: string | null;
      archivedAt: Date | null;
    }>;
  },
) {
  const [row] = await db
    .update(studies)
    .set({ ...params.set, updatedAt: new Date() })
    .where(and(eq(studies.id, params.id), eq(studies.teamId, params.teamId)))
    .returning(studyColumns);
  return row ?? null;
}

/** Writes to a draft only: the status check is part of the write itself. */
export async function updateDraftStudy(
  db: DbOrTx,
  params: {
    id: string;
    teamId: string;
    set: Partial<{
      definition: unknown;
      currentDesignId: null;
      questionnaire: unknown;
      languages: string[];
      translations: Record<string, Record<string, string>>;
      translationSources: Record<string, Record<string, string>>;
    }>;
  },
) {
  const [row] = await db
    .update(studies)
    .set({ ...params.set, updatedAt: new Date() })
    .where(
      and(
        eq(studies.id, params.id),
        eq(studies.teamId, params.teamId),
        eq(studies.status, 'draft'),
      ),
    )
    .returning(studyColumns);
  return row ?? null;
}

/** Only a draft's definition changes. */
export async function updateDraftDefinition(
  db: DbOrTx,
  params: { id: string; teamId: string; definition: unknown; clearDesign: boolean },
) {
  return updateDraftStudy(db, {
    id: params.id,
    teamId: params.teamId,
    set: {
      definition: params.definition,
      ...(params.clearDesign ? { currentDesignId: null } : {}),
    },
  });
}
