/**
 * The one study-definition factory of the tests, the browser journeys and the benchmarks: the
 * invented Larkspur Valley Water scenario (README.md, the demo study) with overrides.
 *
 * It lives in scripts/lib, beside the other helpers that tests, journeys (e2e/) and benchmarks
 * (scripts/) share, so that a benchmark does not depend on tests/; the product (src/, server/,
 * shared/, db/) imports nothing from scripts/ (ESLint checks server/, shared/ and db/). This
 * file imports only shared/ and the seed's pure demo definition, so it also runs in the browser
 * bundle of `bench:shares` and in Playwright without a database.
 */
import type { z } from 'zod';
import {
  studyDefinitionSchema,
  type attributeSchema,
  type Level,
  type StudyDefinition,
} from '../../../shared/schemas/study-definition';
import { demoDefinition } from '../../../server/seed/demo-definition';

export type LarkspurAttributeId = 'bill' | 'interrupt' | 'warn' | 'river' | 'renew';
/** An attribute as written (the schema fills in defaults such as `isCost: false`). */
type AttributeInput = z.input<typeof attributeSchema>;

/** Numeric levels `<prefix><value>` labelled by `label(value)`. */
export const numericLevels = (
  prefix: string,
  values: number[],
  label: (v: number) => string = String,
): Level[] => values.map((v) => ({ id: `${prefix}${v}`, label: label(v), value: v }));

/** Categorical levels whose ids are their labels in lower case (`poor`, `fair`, `good`). */
export const namedLevels = (labels: string[]): Level[] =>
  labels.map((label) => ({ id: label.toLowerCase(), label }));

/** The river as the small set-ups show it: a "River health rating" of capitalised levels. */
export const riverRating = (labels = ['Poor', 'Fair', 'Good']): Partial<AttributeInput> => ({
  name: 'River health rating',
  levels: namedLevels(labels),
});

/** Five attributes with mixed codings (linear, effects, dummy with a chosen reference). */
const larkspurAttributes = (): Record<LarkspurAttributeId, AttributeInput> => ({
  bill: {
    id: 'bill',
    name: 'Monthly bill increase',
    kind: 'numeric',
    unit: '€',
    isCost: true,
    coding: 'linear',
    levels: numericLevels('b', [0, 3, 6, 10, 15], (v) => `€${v}`),
  },
  interrupt: {
    id: 'interrupt',
    name: 'Supply interruptions per year',
    kind: 'numeric',
    coding: 'linear',
    levels: numericLevels('i', [4, 2, 1]),
  },
  warn: {
    id: 'warn',
    name: 'Taste/odour warning days',
    kind: 'numeric',
    coding: 'effects',
    levels: numericLevels('w', [6, 2, 0], (v) => `${v} days`),
  },
  river: {
    id: 'river',
    name: 'River health',
    kind: 'categorical',
    coding: 'dummy',
    levels: namedLevels(['poor', 'fair', 'good']),
  },
  renew: {
    id: 'renew',
    name: 'Renewable pumping energy',
    kind: 'numeric',
    unit: '%',
    coding: 'dummy',
    referenceLevelId: 'r50',
    levels: numericLevels('r', [20, 50, 80], (v) => `${v} %`),
  },
});

/** The status quo of the scenario: today's bill, interruptions, warnings, river and energy. */
const STATUS_QUO_LEVELS: Record<LarkspurAttributeId, string> = {
  bill: 'b0',
  interrupt: 'i4',
  warn: 'w6',
  river: 'poor',
  renew: 'r20',
};

export type StudyDefinitionOverrides = Partial<Omit<StudyDefinition, 'attributes'>> & {
  /** The attributes to keep, in this order (default: all five); the status quo follows. */
  only?: LarkspurAttributeId[];
  /** Field changes per attribute, merged over the scenario's attribute (e.g. another coding). */
  attributes?: Partial<Record<LarkspurAttributeId, Partial<AttributeInput>>>;
};

/**
 * The Larkspur study definition: two unlabeled packages plus the status quo ("Current
 * service"), five attributes with mixed codings, no excluded combinations. Overrides replace
 * top-level fields, pick attributes (`only`) or change fields of single attributes; the result
 * is parsed by the product's own schema, so an override that makes it invalid throws here.
 */
export function makeStudyDefinition(overrides: StudyDefinitionOverrides = {}): StudyDefinition {
  const { only, attributes: changes = {}, ...rest } = overrides;
  const ids = only ?? (Object.keys(STATUS_QUO_LEVELS) as LarkspurAttributeId[]);
  const base = larkspurAttributes();
  const attributes = ids.map((id) => ({ ...base[id], ...changes[id] }));
  const statusQuo = Object.fromEntries(
    attributes.map((a) => [
      a.id,
      a.levels.some((l) => l.id === STATUS_QUO_LEVELS[a.id as LarkspurAttributeId])
        ? STATUS_QUO_LEVELS[a.id as LarkspurAttributeId]
        : a.levels[0].id,
    ]),
  );
  return studyDefinitionSchema.parse({
    attributes,
    alternatives: { count: 2, labeled: false, labels: [] },
    fixedAlternative: { kind: 'status_quo', label: 'Current service', levels: statusQuo },
    excludedCombinations: [],
    ...rest,
  });
}

/**
 * The study with two labeled packages and no status quo: "Basic" shows every attribute,
 * "Green" leaves out `greenOmits` (what labeled-alternative coding and designs are tested on).
 */
export function makeLabeledDefinition(greenOmits: LarkspurAttributeId[]): StudyDefinition {
  return makeStudyDefinition({
    fixedAlternative: null,
    alternatives: {
      count: 2,
      labeled: true,
      labels: [
        { id: 'basic', name: 'Basic', omittedAttributeIds: [] },
        { id: 'green', name: 'Green', omittedAttributeIds: greenOmits },
      ],
    },
  });
}

/**
 * The product's own demo definition (server/seed), for set-ups that should match what a new
 * installation shows: descriptions, derived numeric labels and the "costs more than today" rule.
 */
export function makeDemoDefinition(
  overrides: Partial<StudyDefinition> & { only?: string[] } = {},
): StudyDefinition {
  const { only, ...rest } = overrides;
  const demo = structuredClone(demoDefinition);
  if (only) {
    demo.attributes = demo.attributes.filter((a) => only.includes(a.id));
    demo.fixedAlternative!.levels = Object.fromEntries(
      only.map((id) => [id, demo.fixedAlternative!.levels[id]]),
    );
  }
  return studyDefinitionSchema.parse({ ...demo, ...rest });
}
