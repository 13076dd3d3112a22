/**
 * The study lifecycle's data access: frozen versions, status and settings changes, the
 * questionnaire document, and the periodic close check.
 * Tenant: studies by id and team; versions and designs by their study, which the caller loaded
 * for the team; lockStudyForCompletion (the study of the respondent's own link) and
 * listLiveStudiesWithLimits (the scheduler's close check of every team) need none.
 */
import { and, asc, desc, eq, sql } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { designs, studies, studyVersions } from '../schema/studies';
import { respondents } from '../schema/fieldwork';
import { studyColumns, updateDraftStudy } from './studies';

const versionColumns = {
  id: studyVersions.id,
  studyId: studyVersions.studyId,
  version: studyVersions.version,
  definition: studyVersions.definition,
  design: studyVersions.design,
  questionnaire: studyVersions.questionnaire,
  languages: studyVersions.languages,
  translations: studyVersions.translations,
  createdAt: studyVersions.createdAt,
};

/** Locks the study row for the rest of the transaction: lifecycle changes never interleave. */
export async function lockStudy(db: DbOrTx, params: { id: string; teamId: string }) {
  const [row] = await db
    .select(studyColumns)
    .from(studies)
    .where(and(eq(studies.id, params.id), eq(studies.teamId, params.teamId)))
    .for('update');
  return row ?? null;
}

/**
 * Locks a study row for a completion under a quota. FOR NO KEY UPDATE, not FOR UPDATE: answers
 * and respondents being inserted meanwhile hold FOR KEY SHARE on the same row through their
 * foreign keys and must not wait for it.
 */
export async function lockStudyForCompletion(db: DbOrTx, params: { id: string }) {
  const [row] = await db
    .select(studyColumns)
    .from(studies)
    .where(eq(studies.id, params.id))
    .for('no key update');
  return row ?? null;
}

export async function getDesignDocument(db: DbOrTx, params: { id: string; studyId: string }) {
  const [row] = await db
    .select({ id: designs.id, design: designs.design })
    .from(designs)
    .where(and(eq(designs.id, params.id), eq(designs.studyId, params.studyId)));
  return row ?? null;
}

export async function getLatestVersion(db: DbOrTx, params: { studyId: string }) {
  const [row] = await db
    .select(versionColumns)
    .from(studyVersions)
    .where(eq(studyVersions.studyId, params.studyId))
    .orderBy(desc(studyVersions.version))
    .limit(1);
  return row ?? null;
}

/** Every frozen version of a study, oldest first (what an estimation run codes). */
export async function listStudyVersions(db: DbOrTx, params: { studyId: string }) {
  return db
    .select({
      id: studyVersions.id,
      version: studyVersions.version,
      definition: studyVersions.definition,
      design: studyVersions.design,
      questionnaire: studyVersions.questionnaire,
    })
    .from(studyVersions)
    .where(eq(studyVersions.studyId, params.studyId))
    .orderBy(asc(studyVersions.version));
}

/** The id of the study's latest version (without its documents). */
export async function getLatestVersionId(db: DbOrTx, params: { studyId: string }) {
  const [row] = await db
    .select({ id: studyVersions.id, version: studyVersions.version })
    .from(studyVersions)
    .where(eq(studyVersions.studyId, params.studyId))
    .orderBy(desc(studyVersions.version))
    .limit(1);
  return row ?? null;
}

export async function getVersionById(db: DbOrTx, params: { id: string; studyId: string }) {
  const [row] = await db
    .select(versionColumns)
    .from(studyVersions)
    .where(and(eq(studyVersions.id, params.id), eq(studyVersions.studyId, params.studyId)));
  return row ?? null;
}

export async function insertVersion(
  db: DbOrTx,
  params: {
    studyId: string;
    version: number;
    definition: unknown;
    design: unknown;
    questionnaire: unknown;
    /** Absent: the column defaults (English only, no translations). */
    languages?: string[];
    translations?: Record<string, Record<string, string>>;
  },
) {
  const [row] = await db.insert(studyVersions).values(params).returning(versionColumns);
  return row;
}

export async function listVersionsWithCounts(db: DbOrTx, params: { studyId: string }) {
  return db
    .select({
      version: studyVersions.version,
      createdAt: studyVersions.createdAt,
      respondents: sql<number>`count(${respondents.id})::int`.mapWith(Number),
      completes:
        sql<number>`count(${respondents.id}) filter (where ${respondents.status} = 'completed')::int`.mapWith(
          Number,
        ),
    })
    .from(studyVersions)
    .leftJoin(respondents, eq(respondents.versionId, studyVersions.id))
    .where(eq(studyVersions.studyId, params.studyId))
    .groupBy(studyVersions.id)
    .orderBy(asc(studyVersions.version));
}

export async function updateStudyLifecycle(
  db: DbOrTx,
  params: {
    id: string;
    teamId: string;
    status: 'draft' | 'live' | 'closed';
    settings: unknown;
    currentVersion?: number;
  },
) {
  const [row] = await db
    .update(studies)
    .set({
      status: params.status,
      settings: params.settings,
      ...(params.currentVersion !== undefined ? { currentVersion: params.currentVersion } : {}),
      updatedAt: new Date(),
    })
    .where(and(eq(studies.id, params.id), eq(studies.teamId, params.teamId)))
    .returning(studyColumns);
  return row ?? null;
}

export async function updateStudySettings(
  db: DbOrTx,
  params: { id: string; teamId: string; settings: unknown },
) {
  const [row] = await db
    .update(studies)
    .set({ settings: params.settings, updatedAt: new Date() })
    .where(and(eq(studies.id, params.id), eq(studies.teamId, params.teamId)))
    .returning(studyColumns);
  return row ?? null;
}

/** Only a draft's questionnaire changes. */
export async function updateDraftQuestionnaire(
  db: DbOrTx,
  params: { id: string; teamId: string; questionnaire: unknown },
) {
  return updateDraftStudy(db, {
    id: params.id,
    teamId: params.teamId,
    set: { questionnaire: params.questionnaire },
  });
}

/** Only a draft's languages and translations (with the sources they were made from) change. */
export async function updateDraftLanguages(
  db: DbOrTx,
  params: {
    id: string;
    teamId: string;
    languages: string[];
    translations: Record<string, Record<string, string>>;
    translationSources: Record<string, Record<string, string>>;
  },
) {
  return updateDraftStudy(db, {
    id: params.id,
    teamId: params.teamId,
    set: {
      languages: params.languages,
      translations: params.translations,
      translationSources: params.translationSources,
    },
  });
}

/** Live studies with a close date or a quota: candidates for the periodic close check. */
export async function listLiveStudiesWithLimits(db: DbOrTx) {
  return db
    .select({ id: studies.id, teamId: studies.teamId })
    .from(studies)
    .where(
      and(
        eq(studies.status, 'live'),
        sql`(${studies.settings}->>'closeAt' is not null or ${studies.settings}->>'quotaCompletes' is not null)`,
      ),
    );
}
