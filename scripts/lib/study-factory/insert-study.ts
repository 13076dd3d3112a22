/**
 * A study written straight into the tables, for tests and benchmarks whose subject is not
 * how a study is built: a draft with its current design, or a live or closed study with a
 * frozen version 1 (definition, design and questionnaire), as going live would leave it.
 */
import { eq } from 'drizzle-orm';
import { nanoid } from 'nanoid';
import type { Db } from '../../../db/client';
import { designs, studies, studyVersions } from '../../../db/schema/studies';
import type { AppDeps } from '../../../server/deps';
import { goLive } from '../../../server/services/lifecycle';
import { demoQuestionnaire } from '../../../shared/schemas/questionnaire-defaults';
import type { StudyDefinition } from '../../../shared/schemas/study-definition';
import { makeStudyDefinition } from './definition';
import { makeStudyDesign } from './design';

export type StudyRowOverrides = {
  teamId: string;
  name?: string;
  publicTitle?: string;
  publicId?: string;
  /** 'draft' (default) keeps the design as the current design; 'live' and 'closed' freeze version 1. */
  status?: 'draft' | 'live' | 'closed';
  /** Default makeStudyDefinition(); any JSON for tests of what a stored document may hold. */
  definition?: object;
  /** Default makeStudyDesign(definition); null: a draft without a design. */
  design?: object | null;
  /** Default the demo questionnaire of the definition. */
  questionnaire?: object;
  settings?: unknown;
  /** Freeze version 1 (default: unless a draft); a draft with a version is a study set back. */
  frozen?: boolean;
  /** Put the draft live through the lifecycle service, its checks and version freezing included. */
  goLive?: boolean;
};

export type InsertedStudy = {
  studyId: string;
  publicId: string;
  /** The frozen version 1 of a live or closed study (null for a draft). */
  versionId: string | null;
};

export async function insertStudyRow(db: Db, o: StudyRowOverrides): Promise<InsertedStudy> {
  const status = o.status ?? 'draft';
  const definition = o.definition ?? makeStudyDefinition();
  const design = o.design === undefined ? makeStudyDesign(definition as StudyDefinition) : o.design;
  const questionnaire = o.questionnaire ?? demoQuestionnaire(definition as StudyDefinition);
  const [study] = await db
    .insert(studies)
    .values({
      teamId: o.teamId,
      publicId: o.publicId ?? nanoid(16),
      name: o.name ?? 'Larkspur service packages',
      publicTitle: o.publicTitle ?? '',
      status,
      definition,
      questionnaire,
      settings: o.settings ?? {},
    })
    .returning({ id: studies.id, publicId: studies.publicId });
  if (o.frozen ?? status !== 'draft') {
    const versionId = await insertStudyVersion(db, {
      studyId: study.id,
      version: 1,
      definition,
      design: design ?? {},
      questionnaire,
    });
    return { studyId: study.id, publicId: study.publicId, versionId };
  }
  if (design !== null) {
    const [d] = await db
      .insert(designs)
      .values({ studyId: study.id, teamId: o.teamId, method: 'imported', design })
      .returning({ id: designs.id });
    await db.update(studies).set({ currentDesignId: d.id }).where(eq(studies.id, study.id));
  }
  // The lifecycle service only uses the database.
  if (o.goLive) await goLive({ db } as AppDeps, o.teamId, study.id);
  return { studyId: study.id, publicId: study.publicId, versionId: null };
}

/** A frozen version of the study; the study's current version follows it. */
export async function insertStudyVersion(
  db: Db,
  v: {
    studyId: string;
    version: number;
    definition: object;
    design: object;
    questionnaire: object;
  },
): Promise<string> {
  const [row] = await db.insert(studyVersions).values(v).returning({ id: studyVersions.id });
  await db.update(studies).set({ currentVersion: v.version }).where(eq(studies.id, v.studyId));
  return row.id;
}
