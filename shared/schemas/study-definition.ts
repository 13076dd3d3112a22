/**
 * What respondents choose between: attributes and their levels, the alternatives shown per
 * task, an optional opt-out or status-quo alternative, and excluded combinations of levels.
 * Stored as one JSON document per study (and frozen into each live version).
 */
import { z } from 'zod';
import { addIssue } from './add-issue';

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
        addIssue(ctx, ['levels', i, 'value'], 'Numeric levels need a value');
      if (a.kind === 'categorical' && l.label === '')
        addIssue(ctx, ['levels', i, 'label'], 'A level needs a label');
    });
    if (a.coding === 'linear' && a.kind !== 'numeric')
      addIssue(ctx, ['coding'], 'Linear coding needs a numeric attribute');
    if (a.referenceLevelId && !a.levels.some((l) => l.id === a.referenceLevelId))
      addIssue(ctx, ['referenceLevelId'], 'Reference level must be one of the levels');
    const ids = new Set(a.levels.map((l) => l.id));
    if (ids.size !== a.levels.length) addIssue(ctx, ['levels'], 'Level ids must be unique');
    if (a.isCost && a.kind !== 'numeric')
      addIssue(ctx, ['isCost'], 'The cost attribute must be numeric');
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

const levelRefSchema = z.object({ attributeId: elementIdSchema, levelId: elementIdSchema });
const levelSetSchema = z.object({
  attributeId: elementIdSchema,
  levelIds: z.array(elementIdSchema).min(1, 'Choose at least one level').max(12),
});

/** How two levels of one attribute compare: by value (numeric attributes) or by identity. */
export const relationSchema = z.enum([
  'greater',
  'at_least',
  'less',
  'at_most',
  'different',
  'same',
]);
export type Relation = z.infer<typeof relationSchema>;

/**
 * Combinations the design must never show (wording in shared/study/excluded-combinations.ts):
 * - `pair`: two levels of different attributes never together in one alternative;
 * - `when_then`: when an attribute shows one of some levels, another shows one of others;
 * - `versus_status_quo`: an attribute of every designed alternative compared with the status quo;
 * - `between_alternatives`: an attribute of one designed alternative compared with another's.
 */
export const excludedCombinationSchema = z.discriminatedUnion('kind', [
  z.object({ id: elementIdSchema, kind: z.literal('pair'), a: levelRefSchema, b: levelRefSchema }),
  z.object({
    id: elementIdSchema,
    kind: z.literal('when_then'),
    when: levelSetSchema,
    then: levelSetSchema,
  }),
  z.object({
    id: elementIdSchema,
    kind: z.literal('versus_status_quo'),
    attributeId: elementIdSchema,
    relation: relationSchema,
  }),
  z.object({
    id: elementIdSchema,
    kind: z.literal('between_alternatives'),
    attributeId: elementIdSchema,
    /** Designed alternatives (0-based) compared: `first` relation `second`. */
    first: z.number().int().min(0).max(4),
    relation: relationSchema,
    second: z.number().int().min(0).max(4),
  }),
]);
export type ExcludedCombination = z.infer<typeof excludedCombinationSchema>;

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
    excludedCombinations: z.array(excludedCombinationSchema).max(200).default([]),
  })
  .superRefine((d, ctx) => {
    const attrIds = new Set(d.attributes.map((a) => a.id));
    if (attrIds.size !== d.attributes.length)
      addIssue(ctx, ['attributes'], 'Attribute ids must be unique');
    if (d.attributes.filter((a) => a.isCost).length > 1)
      addIssue(ctx, ['attributes'], 'Only one attribute can be the cost');
    if (d.alternatives.labeled && d.alternatives.labels.length !== d.alternatives.count)
      addIssue(ctx, ['alternatives', 'labels'], 'Name every labeled alternative');
    d.excludedCombinations.forEach((rule, i) => {
      for (const message of checkExcludedCombination(d, rule))
        addIssue(ctx, ['excludedCombinations', i], message);
    });
    const fx = d.fixedAlternative;
    if (fx?.kind === 'status_quo') {
      d.attributes.forEach((a) => {
        const lv = fx.levels[a.id];
        if (!lv || !a.levels.some((l) => l.id === lv))
          addIssue(
            ctx,
            ['fixedAlternative', 'levels', a.id],
            `Choose the status-quo level of ${a.name}`,
          );
      });
    }
  });
export type StudyDefinition = z.infer<typeof studyDefinitionSchema>;

export const emptyStudyDefinition: StudyDefinition = {
  attributes: [],
  alternatives: { count: 2, labeled: false, labels: [] },
  fixedAlternative: null,
  excludedCombinations: [],
};

type DefinitionShape = Pick<StudyDefinition, 'attributes' | 'alternatives' | 'fixedAlternative'>;

/** What is wrong with one excluded combination in this definition (empty when nothing). */
function checkExcludedCombination(d: DefinitionShape, rule: ExcludedCombination): string[] {
  const attribute = (id: string) => d.attributes.find((a) => a.id === id);
  const hasLevel = (attributeId: string, levelId: string) =>
    attribute(attributeId)?.levels.some((l) => l.id === levelId) ?? false;
  const ordering = (relation: Relation) => !['different', 'same'].includes(relation);
  const problems: string[] = [];
  switch (rule.kind) {
    case 'pair':
      if (
        !hasLevel(rule.a.attributeId, rule.a.levelId) ||
        !hasLevel(rule.b.attributeId, rule.b.levelId)
      )
        problems.push('The excluded pair refers to an unknown level');
      if (rule.a.attributeId === rule.b.attributeId)
        problems.push('An excluded pair links two different attributes');
      break;
    case 'when_then':
      for (const set of [rule.when, rule.then])
        if (!set.levelIds.every((l) => hasLevel(set.attributeId, l)))
          problems.push('The rule refers to an unknown level');
      if (rule.when.attributeId === rule.then.attributeId)
        problems.push('A “when … then …” rule links two different attributes');
      break;
    case 'versus_status_quo':
    case 'between_alternatives': {
      const a = attribute(rule.attributeId);
      if (!a) problems.push('The rule refers to an unknown attribute');
      else if (ordering(rule.relation) && a.kind !== 'numeric')
        problems.push(`${a.name} is not numeric: compare it as “different” or “the same”`);
      if (rule.kind === 'versus_status_quo' && d.fixedAlternative?.kind !== 'status_quo')
        problems.push('A rule against the status quo needs a status-quo alternative');
      if (rule.kind === 'between_alternatives') {
        const { count, labeled, labels } = d.alternatives;
        if (rule.first === rule.second) problems.push('Compare two different alternatives');
        if (rule.first >= count || rule.second >= count)
          problems.push(`There are only ${count} designed alternatives`);
        else if (
          labeled &&
          [rule.first, rule.second].some((j) =>
            labels[j]?.omittedAttributeIds.includes(rule.attributeId),
          )
        )
          problems.push('One of the two alternatives does not show this attribute');
      }
      break;
    }
  }
  return problems;
}
