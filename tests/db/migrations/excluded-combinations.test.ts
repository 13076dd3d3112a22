/**
 * Migration 0004: stored definitions with "prohibitions" (live studies and frozen versions)
 * read as "excludedCombinations" of kind "pair", with ids and levels kept. The statements are
 * run again on rows written in the old shape (the migration only touches such rows).
 */
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { nanoid } from 'nanoid';
import { createTestDb, type TestDb } from '../../support/test-db';
import { studies, studyVersions } from '../../../db/schema/studies';
import { teams } from '../../../db/schema/accounts';
import { studyDefinitionSchema } from '../../../shared/schemas/study-definition';
import { makeStudyDefinition } from '../../../scripts/lib/study-factory/definition';

let t: TestDb;
beforeAll(async () => {
  t = await createTestDb();
});
afterAll(async () => {
  await t.close();
});

const migration = fs
  .readFileSync(
    path.resolve(import.meta.dirname, '../../../db/migrations/0004_excluded_combinations.sql'),
    'utf8',
  )
  .split('--> statement-breakpoint');

describe('migration 0004_excluded_combinations', () => {
  it('turns stored prohibitions into excluded pairs, in studies and frozen versions', async () => {
    const { excludedCombinations: _, ...current } = makeStudyDefinition();
    const pair = {
      id: 'p1',
      a: { attributeId: 'bill', levelId: 'b15' },
      b: { attributeId: 'river', levelId: 'poor' },
    };
    const old = { ...current, prohibitions: [pair] };
    const [team] = await t.db.insert(teams).values({ name: 'Larkspur' }).returning();
    const [study] = await t.db
      .insert(studies)
      .values({ teamId: team.id, publicId: nanoid(16), name: 'Old study', definition: old })
      .returning();
    const plain = { ...current, prohibitions: [] };
    const [other] = await t.db
      .insert(studies)
      .values({ teamId: team.id, publicId: nanoid(16), name: 'No pairs', definition: plain })
      .returning();
    await t.db.insert(studyVersions).values({
      studyId: study.id,
      version: 1,
      definition: old,
      design: { blocks: 1, tasks: [] },
      questionnaire: {},
    });

    for (const statement of migration) await t.db.execute(sql.raw(statement));

    const [row] = await t.db.select().from(studies).where(eq(studies.id, study.id));
    const [version] = await t.db
      .select()
      .from(studyVersions)
      .where(eq(studyVersions.studyId, study.id));
    for (const definition of [row.definition, version.definition] as Record<string, unknown>[]) {
      expect(definition).not.toHaveProperty('prohibitions');
      expect(definition.excludedCombinations).toEqual([{ ...pair, kind: 'pair' }]);
      expect(studyDefinitionSchema.safeParse(definition).success).toBe(true);
    }
    const [empty] = await t.db.select().from(studies).where(eq(studies.id, other.id));
    expect(empty.definition).toMatchObject({ excludedCombinations: [] });
    expect(empty.definition).not.toHaveProperty('prohibitions');
  });
});
