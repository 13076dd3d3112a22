/**
 * Study use cases: list, create, read, rename, duplicate, archive, and edit the definition.
 * A study's definition and design change only while it is a draft (live/closed are frozen).
 */
import { nanoid } from 'nanoid';
import type { AppDeps } from '../deps';
import { ConflictError, NotFoundError } from '../lib/errors';
import { loadStudy } from './study-access';
import {
  getStudyWithCounts,
  insertStudy,
  listStudies as listStudyRows,
  updateDraftDefinition,
  updateStudy,
} from '../../db/queries/studies';
import { getDesignById, insertCurrentDesign } from '../../db/queries/designs';
import { emptyStudyDefinition, type StudyDefinition } from '../../shared/schemas/study-definition';
import type { Design } from '../../shared/schemas/design';
import type { Study, StudySummary } from '../../shared/schemas/study';
import { designFitsDefinition } from './design-fit';
import type { Actor } from './actor';

type StudyRow = NonNullable<Awaited<ReturnType<typeof getStudyWithCounts>>>;

function toSummary(row: StudyRow): StudySummary {
  return {
    id: row.id,
    publicId: row.publicId,
    name: row.name,
    publicTitle: row.publicTitle,
    description: row.description,
    status: row.status,
    source: row.source,
    archivedAt: row.archivedAt?.toISOString() ?? null,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    counts: {
      attributes: row.attributeCount,
      tasks: row.taskCount,
      blocks: row.blockCount,
      respondents: row.respondentCount,
    },
  };
}

function toStudy(row: StudyRow): Study {
  return {
    ...toSummary(row),
    definition: row.definition as StudyDefinition,
    questionnaire: row.questionnaire,
    currentDesignId: row.currentDesignId,
    currentVersion: row.currentVersion,
  };
}

/** Refuses changes to what respondents see once a study has gone live. */
export function assertDraft(study: { status: string }, what = 'the study'): void {
  if (study.status !== 'draft')
    throw new ConflictError(
      'study_frozen',
      `This study is ${study.status}: ${what} cannot change. Reopen it as a draft to edit.`,
    );
}

/** The team's study, for a change that only a draft allows (`what` names what would change). */
export async function loadDraftStudy(deps: AppDeps, teamId: string, studyId: string, what: string) {
  const study = await loadStudy(deps, teamId, studyId);
  assertDraft(study, what);
  return study;
}

export async function listStudies(deps: AppDeps, teamId: string, archived: boolean) {
  const rows = await listStudyRows(deps.db, { teamId, archived });
  return rows.map(toSummary);
}

export async function getStudy(deps: AppDeps, teamId: string, studyId: string): Promise<Study> {
  const row = await getStudyWithCounts(deps.db, { id: studyId, teamId });
  if (!row) throw new NotFoundError('Study');
  return toStudy(row);
}

export async function createStudy(
  deps: AppDeps,
  actor: Actor,
  input: { name: string; publicTitle?: string; description: string },
): Promise<Study> {
  const row = await insertStudy(deps.db, {
    teamId: actor.teamId,
    publicId: nanoid(16),
    name: input.name,
    publicTitle: input.publicTitle ?? input.name,
    description: input.description,
    definition: emptyStudyDefinition,
    createdBy: actor.userId,
  });
  return getStudy(deps, actor.teamId, row.id);
}

export async function describeStudy(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  input: { name?: string; publicTitle?: string; description?: string },
): Promise<Study> {
  const row = await updateStudy(deps.db, { id: studyId, teamId, set: input });
  if (!row) throw new NotFoundError('Study');
  return getStudy(deps, teamId, studyId);
}

export async function setStudyArchived(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  archived: boolean,
): Promise<Study> {
  const study = await loadStudy(deps, teamId, studyId);
  if (archived && study.status === 'live')
    throw new ConflictError('study_live', 'Close the study before archiving it.');
  await updateStudy(deps.db, {
    id: studyId,
    teamId,
    set: { archivedAt: archived ? (study.archivedAt ?? new Date()) : null },
  });
  return getStudy(deps, teamId, studyId);
}

/** A new draft with the same definition, design and questionnaire; responses are not copied. */
export async function duplicateStudy(deps: AppDeps, actor: Actor, studyId: string): Promise<Study> {
  const source = await loadStudy(deps, actor.teamId, studyId);
  const copyId = await deps.db.transaction(async (tx) => {
    const copy = await insertStudy(tx, {
      teamId: actor.teamId,
      publicId: nanoid(16),
      name: `${source.name} (copy)`.slice(0, 160),
      publicTitle: source.publicTitle,
      description: source.description,
      definition: source.definition,
      questionnaire: source.questionnaire,
      languages: source.languages,
      translations: source.translations,
      translationSources: source.translationSources,
      createdBy: actor.userId,
    });
    if (source.currentDesignId) {
      const design = await getDesignById(tx, { id: source.currentDesignId, teamId: actor.teamId });
      if (design) {
        await insertCurrentDesign(tx, {
          studyId: copy.id,
          teamId: actor.teamId,
          method: design.method,
          spec: design.spec,
          design: design.design,
          diagnostics: design.diagnostics,
          createdBy: actor.userId,
        });
      }
    }
    return copy.id;
  });
  return getStudy(deps, actor.teamId, copyId);
}

/**
 * Saves a validated definition. The attached design stays only if it still fits (same
 * attributes, levels and alternatives); otherwise it is detached and must be regenerated.
 */
export async function saveDefinition(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  definition: StudyDefinition,
): Promise<Study & { designDetached: boolean }> {
  const study = await loadDraftStudy(deps, teamId, studyId, 'its attributes');
  let clearDesign = false;
  if (study.currentDesignId) {
    const design = await getDesignById(deps.db, { id: study.currentDesignId, teamId });
    clearDesign = !design || !designFitsDefinition(definition, design.design as Design);
  }
  const row = await updateDraftDefinition(deps.db, {
    id: studyId,
    teamId,
    definition,
    clearDesign,
  });
  if (!row) assertDraft({ status: 'live' }, 'its attributes');
  return { ...(await getStudy(deps, teamId, studyId)), designDetached: clearDesign };
}
