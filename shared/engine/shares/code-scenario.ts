/**
 * Codes a what-if scenario (alternatives defined by level ids, plus the study's opt-out or
 * status quo) into the J × K rows the share simulator multiplies with the run's coefficients,
 * in the run's coefficient order. Used by the server (exports, welfare) and the browser (live
 * recompute), so both code a scenario the same way.
 */
import type { StudyDefinition } from '../../schemas/study-definition';
import type { ScenarioAlternative } from '../../schemas/shares';
import { buildCodingPlan, type CodingPlan } from '../coding/coding-plan';
import { codeAlternative } from '../coding/code-alternative';

/** A scenario problem with the path of the field at fault (the server answers 400 with it). */
export class ScenarioError extends Error {
  constructor(
    message: string,
    readonly path: string,
    readonly field: string,
  ) {
    super(message);
  }
}

export interface ScenarioCoder {
  plan: CodingPlan;
  definition: StudyDefinition;
  /** Plan column of each run coefficient (−1: not a coded column, codes as 0). */
  at: Int32Array;
}

/** `keys` are the run's coefficient data columns (spec column ?? name), in coefficient order. */
export function createScenarioCoder(
  definition: StudyDefinition,
  keys: readonly string[],
): ScenarioCoder {
  const plan = buildCodingPlan(definition);
  const at = Int32Array.from(keys, (key) => plan.columns.findIndex((c) => c.key === key));
  return { plan, definition, at };
}

/** Copies a plan-ordered row into run order at `out[offset..offset+K)`. */
export function toRunOrder(
  coder: ScenarioCoder,
  row: Float64Array,
  out: Float64Array,
  offset: number,
) {
  const { at } = coder;
  for (let k = 0; k < at.length; k++) out[offset + k] = at[k] >= 0 ? row[at[k]] : 0;
}

/** Throws a ScenarioError when an alternative is unknown or misses a level. */
export function assertScenarioAlternative(
  coder: ScenarioCoder,
  alt: ScenarioAlternative,
  i: number,
): void {
  const { definition, plan } = coder;
  if (alt.alternative >= plan.designedCount)
    throw new ScenarioError(
      'The study has fewer alternatives.',
      `alternatives.${i}.alternative`,
      'Unknown alternative',
    );
  const omitted = definition.alternatives.labels[alt.alternative]?.omittedAttributeIds ?? [];
  for (const a of definition.attributes)
    if (!omitted.includes(a.id) && !a.levels.some((l) => l.id === alt.levels[a.id]))
      throw new ScenarioError(
        `Choose a level of ${a.name}.`,
        `alternatives.${i}.levels.${a.id}`,
        `Choose a level of ${a.name}`,
      );
}

export interface CodedScenario {
  /** Row-major J × K in run coefficient order; the status quo last when included. */
  rows: Float64Array;
  names: string[];
  /** The status quo's (or opt-out's) name when included, else null. */
  baseline: string | null;
}

export function codeScenario(
  coder: ScenarioCoder,
  alternatives: readonly ScenarioAlternative[],
  includeFixed: boolean,
): CodedScenario {
  const { plan, definition } = coder;
  const K = coder.at.length;
  const withFixed = includeFixed && plan.fixed !== null;
  const J = alternatives.length + (withFixed ? 1 : 0);
  const rows = new Float64Array(J * K);
  const names: string[] = [];
  alternatives.forEach((alt, i) => {
    assertScenarioAlternative(coder, alt, i);
    toRunOrder(coder, codeAlternative(plan, alt.alternative, alt.levels), rows, i * K);
    names.push(alt.name);
  });
  let baseline: string | null = null;
  if (withFixed) {
    toRunOrder(coder, codeAlternative(plan, 'fixed', {}), rows, alternatives.length * K);
    baseline = definition.fixedAlternative!.label;
    names.push(baseline);
  }
  return { rows, names, baseline };
}
