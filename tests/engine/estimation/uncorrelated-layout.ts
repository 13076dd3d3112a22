import {
  createMixedLogitLayout,
  type CoefficientDistribution,
} from '../../../server/engine/estimation/mixed-logit-layout';

/**
 * The uncorrelated mixed-logit layout of `data` with one coefficient per entry of
 * `distributions`, named by its key, in the order written: `{ x: 'fixed', cost: 'normal' }`.
 */
export const uncorrelatedLayout = (
  data: Parameters<typeof createMixedLogitLayout>[0],
  distributions: Record<string, CoefficientDistribution>,
) =>
  createMixedLogitLayout(
    data,
    Object.entries(distributions).map(([name, distribution]) => ({ name, distribution })),
    false,
  );
