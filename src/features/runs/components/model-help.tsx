/**
 * When to prefer which model family: shown under the model choice of the run form.
 * Practitioners' rules of thumb (common practice, no source), kept short.
 */
import type { RunFormModel } from '../utils/run-form-values';

const help: Record<RunFormModel, string> = {
  mnl: 'One set of tastes for everyone. Fast and the baseline for every comparison; use it first, and for starting values.',
  mixed:
    'Tastes vary continuously across respondents (simulated maximum likelihood). Gives population means and spreads with classical SEs and each respondent’s conditional mean.',
  hb: 'The same continuous taste model estimated by Gibbs sampling: no local optima, copes with many correlated random coefficients, and gives each respondent a posterior mean and interval. Check the convergence diagnostics before you use it.',
  latent_class:
    'Tastes come in a few distinct segments. Prefer it when you expect groups (or want to describe them by background answers); compare class counts by BIC.',
};

export function ModelHelp({ model }: { model: RunFormModel }) {
  return (
    <p className="rounded-md bg-primary-soft/60 px-3 py-2 text-xs text-ink-soft">{help[model]}</p>
  );
}
