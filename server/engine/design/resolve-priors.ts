/**
 * Turns the spec's priors (keyed by coded-column key) into per-column mean and SD arrays in
 * the coding plan's column order. Every column needs exactly one entry.
 */
import type { CodingPlan } from '../../../shared/engine/coding/coding-plan';
import type { DesignPriors } from '../../../shared/schemas/design-spec';
import { DesignError } from './design-errors';

export interface ResolvedPriors {
  means: Float64Array;
  sds: Float64Array;
  /** Draws the criterion averages over (1 for zero / fixed priors). */
  draws: number;
}

function fail(message: string): never {
  throw new DesignError('invalid_spec', message, { 'priors.columns': message });
}

export function resolvePriors(plan: CodingPlan, priors: DesignPriors): ResolvedPriors {
  const K = plan.columnCount;
  const means = new Float64Array(K);
  const sds = new Float64Array(K);
  if (priors.kind === 'zero') return { means, sds, draws: 1 };
  const index = new Map(plan.columns.map((c, k) => [c.key, k]));
  const seen = new Set<string>();
  for (const column of priors.columns) {
    const k = index.get(column.key);
    if (k === undefined) fail(`Unknown coded column "${column.key}"`);
    if (seen.has(column.key)) fail(`Prior for "${column.key}" given twice`);
    seen.add(column.key);
    means[k] = column.mean;
    if ('sd' in column) sds[k] = column.sd;
  }
  const missing = plan.columns.filter((c) => !seen.has(c.key)).map((c) => c.name);
  if (missing.length > 0)
    fail(`Give a prior for every coded column; missing: ${missing.join(', ')}`);
  return { means, sds, draws: priors.kind === 'bayesian' ? priors.draws : 1 };
}
