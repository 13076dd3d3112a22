/**
 * What respondents choose between: attributes and their levels, the alternatives shown per
 * task, an optional opt-out or status-quo alternative, and prohibited level combinations.
 * Stored as one JSON document per study (and frozen into each live version).
 */
import { z } from 'zod';

/** Short stable ids for attributes, levels and labeled alternatives (nanoid, 10 chars). */
export const elementIdSchema = z
  .string()
  .min(1)
  .max(32)
  .regex(/^[A-Za-z0-9_-]+$/, 'Use letters, digits, _ or -');

export const codingSchema = z.enum(['dummy', 'effects', 'linear']);
export type Coding = z.infer<typeof codingSchema>;

export const levelSchema = z.object({
  id: elementIdSchema,
  /**
   * Shown to respondents. Categorical levels need one. Numeric levels: an override of the
   * label derived from value and unit (shared/study/level-labels.ts); empty = derived.
   */
  label: z.string().trim().max(120).default(''),
  /** Numeric attributes only: the value used for linear coding and formatting. */
  value: z.number().finite().optional(),
  /**
   * Numeric levels whose override does not write the value: the value and label the
   * researcher confirmed as meant. Stale once either changes.
   */
  labelConfirmed: z
    .object({ value: z.number().finite(), label: z.string().trim().max(120) })
    .optional(),
  /** Key of an uploaded image in the storage module. */
  imageKey: z.string().max(200).optional(),
});
export type Level = z.infer<typeof levelSchema>;

export const attributeSchema = z
  .object({
    id: elementIdSchema,
    name: z.string().trim().min(1, 'An attribute needs a name').max(120),
    description: z.string().max(1000).optional(),
    kind: z.enum(['categorical', 'numeric']),
    unit: z.string().max(40).optional(),
    isCost: z.boolean().default(false),
    coding: codingSchema,
    /** Dummy coding only: the level left out (defaults to the first). */
    referenceLevelId: elementIdSchema.optional(),
    levels: z.array(levelSchema).min(2, 'An attribute needs at least 2 levels').max(12),
  })
  .superRefine((a, ctx) => {
    a.levels.forEach((l, i) => {
      if (a.kind === 'numeric' && l.value === undefined)
        ctx.addIssue({
          code: 'custom',
          path: ['levels', i, 'value'],
          message: 'Numeric levels need a value',
        });
      if (a.kind === 'categorical' && l.label === '')
        ctx.addIssue({
          code: 'custom',
          path: ['levels', i, 'label'],
          message: 'A level needs a label',
        });
    });
    if (a.coding === 'linear' && a.kind !== 'numeric')
      ctx.addIssue({
        code: 'custom',
        path: ['coding'],
        message: 'Linear coding needs a numeric attribute',
      });
    if (a.referenceLevelId && !a.levels.some((l) => l.id === a.referenceLevelId))
      ctx.addIssue({
        code: 'custom',
        path: ['referenceLevelId'],
        message: 'Reference level must be one of the levels',
      });
    const ids = new Set(a.levels.map((l) => l.id));
    if (ids.size !== a.levels.length)
      ctx.addIssue({ code: 'custom', path: ['levels'], message: 'Level ids must be unique' });
    if (a.isCost && a.kind !== 'numeric')
      ctx.addIssue({
        code: 'custom',
        path: ['isCost'],
        message: 'The cost attribute must be numeric',
      });
  });
export type Attribute = z.infer<typeof attributeSchema>;

export const labeledAlternativeSchema = z.object({
  id: elementIdSchema,
  name: z.string().trim().min(1, 'A labeled alternative needs a name').max(80),
  /** Attributes that do not apply to this alternative (not shown, coded as zero). */
  omittedAttributeIds: z.array(elementIdSchema).default([]),
});
export type LabeledAlternative = z.infer<typeof labeledAlternativeSchema>;

export const fixedAlternativeSchema = z.object({
  kind: z.enum(['opt_out', 'status_quo']),
  label: z.string().trim().min(1).max(80),
  /** Status quo only: the fixed level of every attribute (attribute id -> level id). */
  levels: z.record(z.string(), elementIdSchema).default({}),
});
export type FixedAlternative = z.infer<typeof fixedAlternativeSchema>;

export const prohibitionSchema = z.object({
  id: elementIdSchema,
  a: z.object({ attributeId: elementIdSchema, levelId: elementIdSchema }),
  b: z.object({ attributeId: elementIdSchema, levelId: elementIdSchema }),
});
export type Prohibition = z.infer<typeof prohibitionSchema>;

export const studyDefinitionSchema = z
  .object({
    attributes: z.array(attributeSchema).max(20),
    alternatives: z.object({
      /** Designed alternatives per task, not counting the opt-out / status quo. */
      count: z
        .number()
        .int()
        .min(2, 'At least 2 alternatives per task')
        .max(5, 'At most 5 alternatives per task'),
      labeled: z.boolean().default(false),
      /** One entry per designed alternative when labeled; empty when unlabeled. */
      labels: z.array(labeledAlternativeSchema).default([]),
    }),
    fixedAlternative: fixedAlternativeSchema.nullable().default(null),
    prohibitions: z.array(prohibitionSchema).default([]),
  })
  .superRefine((d, ctx) => {
    const attrIds = new Set(d.attributes.map((a) => a.id));
    if (attrIds.size !== d.attributes.length)
      ctx.addIssue({
        code: 'custom',
        path: ['attributes'],
        message: 'Attribute ids must be unique',
      });
    if (d.attributes.filter((a) => a.isCost).length > 1)
      ctx.addIssue({
        code: 'custom',
        path: ['attributes'],
        message: 'Only one attribute can be the cost',
      });
    if (d.alternatives.labeled && d.alternatives.labels.length !== d.alternatives.count)
      ctx.addIssue({
        code: 'custom',
        path: ['alternatives', 'labels'],
        message: 'Name every labeled alternative',
      });
    const levelOf = (attributeId: string, levelId: string) =>
      d.attributes.find((a) => a.id === attributeId)?.levels.some((l) => l.id === levelId) ?? false;
    d.prohibitions.forEach((p, i) => {
      if (!levelOf(p.a.attributeId, p.a.levelId) || !levelOf(p.b.attributeId, p.b.levelId))
        ctx.addIssue({
          code: 'custom',
          path: ['prohibitions', i],
          message: 'Prohibition refers to an unknown level',
        });
      if (p.a.attributeId === p.b.attributeId)
        ctx.addIssue({
          code: 'custom',
          path: ['prohibitions', i],
          message: 'A prohibition links two different attributes',
        });
    });
    const fx = d.fixedAlternative;
    if (fx?.kind === 'status_quo') {
      d.attributes.forEach((a) => {
        const lv = fx.levels[a.id];
        if (!lv || !a.levels.some((l) => l.id === lv))
          ctx.addIssue({
            code: 'custom',
            path: ['fixedAlternative', 'levels', a.id],
            message: `Choose the status-quo level of ${a.name}`,
          });
      });
    }
  });
export type StudyDefinition = z.infer<typeof studyDefinitionSchema>;

export const emptyStudyDefinition: StudyDefinition = {
  attributes: [],
  alternatives: { count: 2, labeled: false, labels: [] },
  fixedAlternative: null,
  prohibitions: [],
};
