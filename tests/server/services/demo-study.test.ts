import { describe, expect, it } from 'vitest';
import { useTestApp } from '../../support/test-app';
import { signUpOwner } from '../../support/factories';
import { ensureDemoStudy, DEMO_STUDY_NAME } from '../../../server/seed/demo-study';
import { getStudyById } from '../../../db/queries/studies';
import { getDesignById } from '../../../db/queries/designs';
import type { Design } from '../../../shared/schemas/design';

const t = useTestApp();

describe('ensureDemoStudy', () => {
  it('creates the draft demo study with a D-efficient design of 16 tasks in 2 blocks, once', async () => {
    const { teamId, user } = await signUpOwner(t);
    const id = await ensureDemoStudy(t.deps.db, { teamId, ownerId: user.id });
    expect(await ensureDemoStudy(t.deps.db, { teamId, ownerId: user.id })).toBe(id);

    const study = await getStudyById(t.deps.db, { id, teamId });
    expect(study).toMatchObject({ name: DEMO_STUDY_NAME, status: 'draft' });
    const definition = study!.definition as { attributes: { name: string }[] };
    expect(definition.attributes.map((a) => a.name)).toEqual([
      'Monthly bill increase',
      'Supply interruptions per year',
      'Days of taste/odour warnings per year',
      'River health rating',
      'Share of renewable pumping energy',
    ]);
    const row = await getDesignById(t.deps.db, { id: study!.currentDesignId!, teamId });
    const design = row!.design as Design;
    expect(row!.method).toBe('d_efficient');
    expect(design.blocks).toBe(2);
    expect(design.tasks).toHaveLength(16);
    expect(design.tasks.filter((x) => x.block === 1)).toHaveLength(8);
    expect(design.tasks.every((x) => x.alternatives.length === 2)).toBe(true);
    const diagnostics = row!.diagnostics as { dError: number; priorsKind: string };
    expect(diagnostics.priorsKind).toBe('fixed');
    expect(diagnostics.dError).toBeGreaterThan(0);
  });
});
