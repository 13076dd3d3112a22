/**
 * The estimates, WTP and fit tables of a run, as the Estimates screen shows them (parameter
 * rows from shared/results/parameter-rows.ts, WTP headings from shared/results/parameter-labels.ts),
 * each column documented with its meaning, unit and coding for the codebook.
 */
import type { RunContext } from '../tastes/run-context';
import type { RunResult } from '../../../shared/schemas/run';
import type { EstimationSpec } from '../../../shared/schemas/estimation-spec';
import { getParameterRows } from '../../../shared/results/parameter-rows';
import { getLabelOf, getWtpHeadings } from '../../../shared/results/parameter-labels';
import { getMoneyUnit, getWtpUnit } from '../../../shared/engine/coding/wtp-unit';
import { MODEL_LABELS } from '../../../shared/schemas/estimation-families';
import { col, type DocumentedTable } from './documented-table';

const UTILITY = 'utility (logit scale)';

export function buildEstimatesTable(ctx: RunContext): DocumentedTable {
  const bayes = ctx.results.model === 'hb';
  const rows = getParameterRows(ctx.results);
  return {
    name: 'estimates',
    columns: [
      col('parameter', 'text', 'Parameter code as in the run specification and covariance files'),
      col('label', 'text', 'Readable name of the coded column the parameter belongs to'),
      col(
        'part',
        'text',
        'Which part of a random coefficient (mean, spread, Cholesky term); empty for a fixed coefficient',
      ),
      col(
        'estimate',
        'estimate',
        bayes
          ? 'Posterior mean over the kept draws'
          : 'Maximum-likelihood estimate; spreads as |s| (the data identify the size of a spread, not its sign)',
        `${UTILITY} per one-unit change of the coded column (lognormal: of ln |β|)`,
      ),
      col('se', 'estimate', bayes ? 'Posterior SD' : 'Classical standard error', 'as estimate'),
      col(
        'robust_se',
        'estimate',
        'Robust (sandwich, clustered by respondent) standard error; empty when not computed',
        'as estimate',
      ),
      col(
        't',
        'ratio',
        'estimate / robust SE (classical SE when no robust one); empty for HB',
        'none',
      ),
      col(
        'p',
        'p',
        'Two-sided p-value of t under the normal approximation; empty for HB',
        'probability 0–1',
      ),
      col(
        'ci95_lower',
        'estimate',
        '95 % interval, lower end: estimate − 1.959964 SE (spreads: carried over to |s|)',
        'as estimate',
      ),
      col(
        'ci95_upper',
        'estimate',
        '95 % interval, upper end: estimate + 1.959964 SE',
        'as estimate',
      ),
    ],
    rows: rows.map((r) => [
      r.name,
      r.label,
      r.part,
      r.estimate,
      r.se,
      r.robustSe,
      r.t,
      r.p,
      r.lower,
      r.upper,
    ]),
  };
}

/**
 * Why a finished run gives no WTP table, or null when it gives one: the Exports screen greys
 * its WTP download with this reason and the download refuses with it (409 wtp_unavailable).
 */
export function getWtpUnavailableReason(
  spec: Pick<EstimationSpec, 'cost'>,
  results: Pick<RunResult, 'wtp' | 'wtpWithheld'>,
): string | null {
  if (!spec.cost) return 'This run has no cost coefficient, so it gives no WTP.';
  if ((results.wtp ?? []).length === 0) return results.wtpWithheld ?? 'This run gives no WTP.';
  return null;
}

/** Null when the run has no WTP (no cost coefficient); rows empty when WTP was withheld. */
export function buildWtpTable(ctx: RunContext): DocumentedTable | null {
  const r = ctx.results;
  if (!ctx.spec.cost) return null;
  const labelOf = getLabelOf(r);
  const keyOf = new Map(r.columns.map((c) => [c.coefficient, c.key]));
  const headings = getWtpHeadings(r);
  const simulated = r.model === 'hb' ? 'posterior draws' : 'Krinsky–Robb';
  const money = ctx.header.costUnit || 'cost units';
  const rows = (r.wtp ?? []).flatMap((w) => {
    const unit =
      getWtpUnit(ctx.definition, keyOf.get(w.name) ?? '') ?? getMoneyUnit(ctx.definition);
    const line = (statistic: string, v: NonNullable<typeof w.median> | typeof w) => [
      w.name,
      labelOf(w.name),
      statistic,
      unit,
      v.estimate,
      v.se,
      v.deltaLower,
      v.deltaUpper,
      v.lower,
      v.upper,
    ];
    return [
      line(headings.mean, w),
      ...(headings.median && w.median ? [line(headings.median, w.median)] : []),
    ];
  });
  return {
    name: 'wtp',
    columns: [
      col('coefficient', 'text', 'Coefficient code of the attribute column'),
      col('label', 'text', 'Readable name of the attribute column'),
      col(
        'statistic',
        'text',
        'Which WTP: at population means (no random taste), population mean or population median',
        'none',
        `"${headings.mean}"${headings.median ? ` or "${headings.median}"` : ''}`,
      ),
      col('unit_basis', 'text', 'What money, for what change: the unit and basis of this row'),
      col('wtp', 'money', 'Willingness to pay, −β/β_cost', money),
      col('se', 'money', 'Delta-method standard error', money),
      col('delta_lower', 'money', '95 % interval, lower end (delta method)', money),
      col('delta_upper', 'money', '95 % interval, upper end (delta method)', money),
      col('sim_lower', 'money', `95 % interval, lower end (${simulated})`, money),
      col('sim_upper', 'money', `95 % interval, upper end (${simulated})`, money),
    ],
    rows,
  };
}

export function buildFitTable(ctx: RunContext): DocumentedTable {
  const r = ctx.results;
  const stat = (key: string, value: number | string | null, meaning: string) => [
    key,
    value,
    meaning,
  ];
  return {
    name: 'fit',
    columns: [
      col('statistic', 'text', 'Fit statistic code'),
      col('value', 'ratio', 'Its value (see the meaning column for the unit)'),
      col('meaning', 'text', 'What the statistic is and how it is computed'),
    ],
    rows: [
      stat('model', MODEL_LABELS[ctx.spec.model], 'Model family'),
      stat('respondents', r.respondents, 'Respondents in the estimation (count)'),
      stat('observations', r.observations, 'Choice observations in the estimation (count)'),
      stat('parameters', r.parameters, 'Estimated parameters K (count)'),
      stat('loglik', r.loglik, 'Log-likelihood at the estimates (simulated for mixed logit)'),
      stat('loglik_null', r.loglikNull, 'Log-likelihood with all parameters zero (equal shares)'),
      stat('rho2', r.rho2, 'McFadden ρ² = 1 − LL/LL₀ (ratio)'),
      stat('adj_rho2', r.adjRho2, 'Adjusted ρ² = 1 − (LL − K)/LL₀ (ratio)'),
      stat('aic', r.aic, 'AIC = −2LL + 2K'),
      stat('bic', r.bic, 'BIC = −2LL + K ln(choice observations)'),
      stat(
        'hit_rate',
        r.hitRate,
        'Share of choice observations where the chosen alternative had the highest predicted probability (0–1)',
      ),
      stat(
        'holdout_hit_rate',
        r.holdoutHitRate,
        'Hit rate on holdout tasks (0–1); empty without holdouts',
      ),
      stat('iterations', r.iterations, 'Iterations of the optimiser or sampler (count)'),
      stat(
        'converged',
        r.converged ? 'yes' : `no: ${r.convergence.reason}`,
        'Whether the estimation converged',
      ),
    ],
  };
}

export function buildEstimateTables(ctx: RunContext): DocumentedTable[] {
  const wtp = buildWtpTable(ctx);
  return [buildEstimatesTable(ctx), ...(wtp ? [wtp] : []), buildFitTable(ctx)];
}
