/**
 * Validates a design request before any numerics: the study definition and the spec are
 * parsed with their zod schemas, then checked against each other (prior keys, tasks and
 * blocks, identifiability, size limits). Throws DesignError('invalid_spec' | 'too_large')
 * with field messages; returns the spec with defaults filled and priors as arrays.
 */
import type { z } from 'zod';
import { buildCodingPlan, type CodingPlan } from '../../../shared/engine/coding/coding-plan';
import { designSpecSchema, type DesignSpec } from '../../../shared/schemas/design-spec';
import {
  studyDefinitionSchema,
  type StudyDefinition,
} from '../../../shared/schemas/study-definition';
import { DesignError } from './design-errors';
import { getRowsPerTask } from './design-grid';
import { countFullFactorial, MAX_FULL_FACTORIAL } from './full-factorial';
import { getMaxDrawDimensions } from '../draws/uniform-draws';
import { resolvePriors } from './resolve-priors';
import { buildCriterionSetup, getCriterionUnavailableReason } from './design-criteria';

const MAX_HALTON_DIMENSION = getMaxDrawDimensions('halton');

export interface CheckedDesignSpec {
  spec: DesignSpec;
  definition: StudyDefinition;
  plan: CodingPlan;
  /** Prior means and SDs per coded column (zeros for zero priors). */
  priorMeans: Float64Array;
  priorSds: Float64Array;
  /** Number of prior draws the criterion averages over (1 for zero/fixed priors). */
  draws: number;
}

/** Largest R·K² (doubles) the exchange keeps in memory (two copies, 8 bytes each ≈ 256 MB). */
const MAX_INFO_DOUBLES = 16_000_000;

function fail(path: string, message: string): never {
  throw new DesignError('invalid_spec', message, { [path]: message });
}

/** `input` parsed by `schema`, or DesignError('invalid_spec') with one message per field. */
function parseOrFail<T>(schema: z.ZodType<T>, input: unknown, message: string, prefix: string): T {
  const parsed = schema.safeParse(input);
  if (parsed.success) return parsed.data;
  const fields: Record<string, string> = {};
  for (const issue of parsed.error.issues) {
    const key = [prefix, ...issue.path.map(String)].filter(Boolean).join('.');
    fields[key] ??= issue.message;
  }
  throw new DesignError('invalid_spec', message, fields);
}

/** Checks a design request; see the file comment. */
export function checkDesignSpec(definitionInput: unknown, specInput: unknown): CheckedDesignSpec {
  const definition = parseOrFail(
    studyDefinitionSchema,
    definitionInput,
    'The study definition is not valid',
    'definition',
  );
  const spec = {
    ...parseOrFail(designSpecSchema, specInput, 'The design settings are not valid', ''),
  };
  if (definition.attributes.length === 0)
    fail('definition.attributes', 'Add at least one attribute before designing tasks');

  const plan = buildCodingPlan(definition);
  const K = plan.columnCount;
  const { means: priorMeans, sds: priorSds, draws } = resolvePriors(plan, spec.priors);
  const uncertain = Array.from(priorSds).filter((s) => s > 0).length;
  if (uncertain > MAX_HALTON_DIMENSION)
    fail('priors.columns', `At most ${MAX_HALTON_DIMENSION} priors can have an SD above 0`);

  if (spec.method === 'full_factorial') {
    const total = countFullFactorial(plan);
    if (total > MAX_FULL_FACTORIAL)
      throw new DesignError(
        'too_large',
        `The full factorial has ${total} profiles, more than the ${MAX_FULL_FACTORIAL} allowed; use a random or D-efficient design.`,
        { method: 'Too many profiles for a full factorial' },
      );
  }
  const S = spec.tasks ?? 0;
  const Jt = getRowsPerTask(plan);
  if (spec.method !== 'full_factorial') {
    if (spec.blocks > S) fail('blocks', 'More blocks than tasks');
    // Each task adds at most Jt − 1 independent directions to the information matrix.
    const needed = Math.ceil(K / (Jt - 1));
    if (S < needed)
      fail('tasks', `At least ${needed} tasks are needed to estimate ${K} parameters`);
  }
  const setup = buildCriterionSetup(plan, definition, spec.criterion, priorMeans, spec.tValue);
  const unavailable = getCriterionUnavailableReason(setup, spec.criterion, priorMeans);
  if (unavailable) fail('criterion', unavailable);
  if (spec.method === 'd_efficient' && draws * K * K > MAX_INFO_DOUBLES)
    fail('priors.draws', 'Too many prior draws for this many parameters; use fewer draws');
  return { spec, definition, plan, priorMeans, priorSds, draws };
}
