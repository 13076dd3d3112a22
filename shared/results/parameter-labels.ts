/**
 * Readable names for a run's parameters and derived quantities, from the study's column labels
 * ("Supply interruptions per year — spread (SD)"), never the coefficient codes.
 */
import type { RunResult } from '../schemas/run';

export type LabelOf = (coefficient: string) => string;

export function getLabelOf(results: Pick<RunResult, 'columns'>): LabelOf {
  const labels = new Map(results.columns.map((c) => [c.coefficient, c.label]));
  return (name) => labels.get(name) ?? name;
}

/** What the location and spread parameters of each distribution are. */
const partLabels: Record<string, [string, string]> = {
  normal: ['mean', 'spread (SD)'],
  lognormal: ['mean of ln β', 'spread (SD of ln β)'],
  neg_lognormal: ['mean of ln(−β)', 'spread (SD of ln(−β))'],
  triangular: ['centre', 'spread (half-width)'],
  uniform: ['centre', 'spread (half-width)'],
};

/** "Supply interruptions per year" and its part ("mean", "spread (SD)", "Cholesky term with …"). */
export function describeParameter(
  name: string,
  labelOf: LabelOf,
  distributionOf: (coefficient: string) => string | undefined,
): { label: string; part: string | null } {
  if (name.startsWith('chol.')) {
    const [, a, b] = name.split('.');
    return {
      label: labelOf(a),
      part: a === b ? 'Cholesky diagonal term' : `Cholesky term with ${labelOf(b)}`,
    };
  }
  const [coefficient, part] = name.split('.');
  if (!part) return { label: labelOf(coefficient), part: null };
  const labels = partLabels[distributionOf(coefficient) ?? ''];
  if (part === 'mean') return { label: labelOf(coefficient), part: labels ? labels[0] : 'mean' };
  if (part === 'sd' || part === 'spread')
    return { label: labelOf(coefficient), part: labels ? labels[1] : 'spread' };
  return { label: labelOf(coefficient), part };
}

type Derived = NonNullable<RunResult['derived']>[number];

/** "Population SD of Supply interruptions per year", "Correlation of A and B". */
export function describeDerived(d: Derived, labelOf: LabelOf): string {
  const [a, b] = d.name.split('~');
  switch (d.quantity) {
    case 'mean':
      return `Population mean of ${labelOf(a)}`;
    case 'median':
      return `Population median of ${labelOf(a)}`;
    case 'sd':
      return `Population spread (SD) of ${labelOf(a)}`;
    case 'wrong_sign_share':
      return `Share of the population with the sign opposite to the mean: ${labelOf(a)}`;
    case 'correlation':
      return `Correlation of ${labelOf(a)} and ${labelOf(b ?? a)}`;
    case 'covariance':
      return a === b
        ? `Variance of ${labelOf(a)}`
        : `Covariance of ${labelOf(a)} and ${labelOf(b ?? a)}`;
    default:
      return d.label;
  }
}

/** "WTP at population means" (no taste varies) or the population mean and median WTP. */
export function getWtpHeadings(results: RunResult): { mean: string; median: string | null } {
  const wtp = results.wtp ?? [];
  const varies = results.population.some((m) => m.distribution !== 'fixed');
  // With fixed coefficients the median equals the mean: one set of columns is enough.
  const hasMedian = wtp.some(
    (w) => w.median && Math.abs(w.median.estimate - w.estimate) > 1e-9 * Math.abs(w.estimate),
  );
  if (!varies) return { mean: 'WTP at population means', median: null };
  return {
    mean: 'Population mean WTP',
    median: hasMedian ? 'Population median WTP' : null,
  };
}
