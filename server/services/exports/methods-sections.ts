/**
 * What a results file says about how its numbers were made, by model family: the estimator and
 * what the per-respondent columns mean; for hierarchical Bayes the priors, the sampler settings
 * and the convergence diagnostics (R-hat and ESS per parameter, acceptance per chain); for the
 * latent class logit the class-count table, class shares and class estimates with their SEs.
 * Written as the XLSX "Methods" sheet and as sections of the run report (one source for both).
 */
import type { RunContext } from '../tastes/run-context';
import { MODEL_LABELS } from '../../../shared/schemas/estimation-families';

export type MethodsCell = string | number | null;
export type MethodsSection = { title: string; head: string[]; rows: MethodsCell[][] };

const PRIOR_SOURCES: Record<string, string> = {
  rossi: 'Rossi, Allenby & McCulloch (2005): ν = K + 3, scale = ν',
  train: 'Train (2009), Discrete Choice Methods with Simulation, §12.5: IW(K, K·I)',
  custom: 'set in the run specification',
};

/** What mean_/sd_ (and the family's extra columns) of the per-respondent table are. */
function describeColumns(ctx: RunContext): MethodsCell[][] {
  switch (ctx.spec.model) {
    case 'hb':
      return [
        ['mean_, sd_', 'Posterior mean and SD of the respondent’s coefficient over the kept draws'],
        ['lower95_, upper95_', 'Central 95 % posterior interval (2.5 % and 97.5 % quantiles)'],
        ['wtp_, wtp_sd_, wtp_lower95_, wtp_upper95_', 'The same for −β/β_cost, draw by draw'],
        ['effective_draws', 'Smallest effective sample size of the respondent’s coefficients'],
      ];
    case 'latent_class':
      return [
        ['likeliest_class, p_class_', 'Posterior class probabilities given the choices'],
        ['mean_, sd_', 'Class-probability-weighted mean and SD of the class coefficients'],
        ['wtp_', 'Class-probability-weighted WTP'],
        ['effective_classes', '1 / Σ p_class²: near 1 when one class is clear'],
      ];
    default:
      return [
        [
          'mean_, sd_',
          'Conditional mean and SD given the respondent’s choices (Train 2009, ch. 11)',
        ],
        ['wtp_', 'Conditional mean of −β/β_cost'],
        ['effective_draws', 'Effective number of simulation draws behind the conditional mean'],
      ];
  }
}

function hbSections(ctx: RunContext): MethodsSection[] {
  const s = ctx.results.sampler;
  const d = ctx.results.diagnostics;
  const out: MethodsSection[] = [];
  if (s)
    out.push(
      {
        title: 'Priors',
        head: ['Item', 'Value'],
        rows: [
          ['Population means μ', `N(${s.priors.muMean}, ${s.priors.muVariance}·I)`],
          ['Covariance Σ', `IW(ν = ${s.priors.nu}, ${s.priors.scale}·I)`],
          ['Preset', `${s.priors.preset}: ${PRIOR_SOURCES[s.priors.preset]}`],
          ['Correlated tastes', s.correlated ? 'yes (full Σ)' : 'no (diagonal Σ)'],
        ],
      },
      {
        title: 'Sampler',
        head: ['Item', 'Value'],
        rows: [
          ['Method', 'Gibbs sampling; random-walk Metropolis–Hastings per respondent'],
          ['Proposal step', 'Adapted during burn-in toward an acceptance rate of 0.3, then fixed'],
          ['Iterations per chain', s.iterations],
          ['Burn-in', s.burnin],
          ['Thinning', s.thin],
          ['MH steps per respondent per iteration', s.steps ?? 1],
          ['Chains', s.chains],
          ['Kept draws per chain', s.keptPerChain],
          ['Seed', s.seed],
        ],
      },
    );
  if (d)
    out.push(
      {
        title: 'Convergence (split R-hat and effective sample size)',
        head: ['Parameter', 'R-hat', 'ESS'],
        rows: [
          ...d.parameters.map((p): MethodsCell[] => [p.name, p.rhat, p.ess]),
          [
            d.flagged
              ? `Flagged: the largest R-hat exceeds ${d.rhatLimit}`
              : `Largest R-hat within ${d.rhatLimit}`,
            d.rhatMax,
            d.essMin,
          ],
        ],
      },
      {
        title: 'Chains',
        head: ['Chain', 'Acceptance in burn-in', 'Acceptance kept', 'Proposal scale'],
        rows: d.chains.map((c) => [c.chain, c.acceptanceBurnin, c.acceptance, c.scale]),
      },
    );
  return out;
}

/** How study runs code background answers (server/services/estimation/membership-covariates.ts). */
const MEMBERSHIP_CODING =
  'Multinomial logit on the background answers, class 1 the reference; single choice: a 0/1 column per option against the first option chosen; numbers as given; a missing answer: a "not answered" 0/1 column (a number also takes the mean of the answers)';

function latentClassSections(ctx: RunContext): MethodsSection[] {
  const r = ctx.results;
  const out: MethodsSection[] = [
    {
      title: 'Estimation',
      head: ['Item', 'Value'],
      rows: [
        ['Method', 'EM from several starts, then Newton-Raphson on the observed log-likelihood'],
        ['Standard errors', 'Observed-data information (Louis 1982)'],
        ['Classes asked', JSON.stringify(ctx.spec.classes ?? null)],
        ['Starts per class count', ctx.spec.starts ?? null],
        ['Membership variables', (r.membership ?? []).join(', ') || 'none (constant shares)'],
        ...((r.membership ?? []).length > 0 ? [['Membership coding', MEMBERSHIP_CODING]] : []),
        ['Classes chosen', r.classes?.length ?? null],
      ],
    },
  ];
  if (r.classSelection)
    out.push({
      title: 'Number of classes',
      head: ['Classes', 'LL', 'Parameters', 'AIC', 'BIC', 'CAIC', 'Starts at best LL', 'Note'],
      rows: r.classSelection.map((c) => [
        c.classes,
        c.loglik,
        c.parameters,
        c.aic,
        c.bic,
        c.caic,
        `${c.bestStarts} of ${c.starts}`,
        c.reason,
      ]),
    });
  for (const c of r.classes ?? [])
    out.push({
      title: `Class ${c.class}: share ${c.share.toFixed(3)} (SE ${c.shareSe?.toFixed(3) ?? '—'})`,
      head: ['Parameter', 'Estimate', 'SE'],
      rows: [
        ...c.estimates.map((e) => [e.name, e.estimate, e.se]),
        ...(c.wtp ?? []).map((e) => [`WTP ${e.name}`, e.estimate, e.se]),
        ...c.membership.map((e) => [`membership ${e.name}`, e.estimate, e.se]),
      ],
    });
  return out;
}

function classicalSection(ctx: RunContext): MethodsSection {
  const r = ctx.results;
  return {
    title: 'Estimation',
    head: ['Item', 'Value'],
    rows: [
      ['Method', r.draws ? 'Maximum simulated likelihood' : 'Maximum likelihood'],
      [
        'Estimation draws',
        r.draws ? `${r.draws.count} ${r.draws.type}, seed ${r.draws.seed}` : null,
      ],
      ['Covariance of the estimates', r.covariance?.used ?? 'classical'],
    ],
  };
}

export function getMethodsSections(ctx: RunContext): MethodsSection[] {
  const model = ctx.spec.model;
  const family =
    model === 'hb'
      ? hbSections(ctx)
      : model === 'latent_class'
        ? latentClassSections(ctx)
        : [classicalSection(ctx)];
  return [
    {
      title: 'Model',
      head: ['Coefficient', 'Distribution'],
      rows: [
        [MODEL_LABELS[model], null],
        ...ctx.spec.coefficients.map((c): MethodsCell[] => [c.name, c.distribution]),
      ],
    },
    ...family,
    { title: 'Per-respondent columns', head: ['Columns', 'Meaning'], rows: describeColumns(ctx) },
  ];
}
