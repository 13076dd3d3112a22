/**
 * The facts a results file states about itself: the model, the data it was fitted to, when it
 * was made and the cautions. Written as the first sheet of the XLSX and atop the run report.
 */
import type { RunContext } from '../tastes/run-context';
import { erasureNotice, tasteCautions } from '../../../shared/schemas/exports';
import { MODEL_LABELS } from '../../../shared/schemas/estimation-families';
import { drawsTypeLabels } from '../../../shared/schemas/estimation-spec';

export type SummaryLine = [label: string, value: string | number];

export function describeModel(ctx: RunContext): string {
  const coefficients = ctx.spec.coefficients.map((c) => `${c.name} (${c.distribution})`).join(', ');
  return `${MODEL_LABELS[ctx.spec.model]}: ${coefficients}`;
}

export function getRunSummary(ctx: RunContext, exportedAt: Date): SummaryLine[] {
  const r = ctx.results;
  const draws = r.draws
    ? `${r.draws.count} ${drawsTypeLabels[r.draws.type]} draws, seed ${r.draws.seed}`
    : 'none';
  const profileDraws = r.profileDraws
    ? `${r.profileDraws.count} ${drawsTypeLabels[r.profileDraws.type]} draws, seed ${r.profileDraws.seed}`
    : 'none';
  return [
    ['Study', ctx.study.name],
    ['Study version', ctx.version ? ctx.version.version : 'not live yet'],
    ['Run', ctx.run.name || ctx.run.id],
    ['Run id', ctx.run.id],
    ['Model', describeModel(ctx)],
    ['Cost coefficient (WTP denominator)', ctx.spec.cost ?? 'none'],
    ['Estimation draws', draws],
    ['Taste-profile draws', profileDraws],
    ['Respondents', r.respondents],
    ...(ctx.run.erasedRespondents > 0
      ? [['Erased since this run', erasureNotice(ctx.run.erasedRespondents)] as SummaryLine]
      : []),
    ['Choice observations', r.observations],
    ['Log-likelihood', r.loglik],
    ['Converged', r.converged ? 'yes' : `no (${r.convergence.reason})`],
    ['Data hash (SHA-256 of the long-format choice data)', ctx.run.dataHash ?? 'not recorded'],
    ['Run finished', ctx.run.finishedAt?.toISOString() ?? ''],
    ['Exported', exportedAt.toISOString()],
    [
      'Personal data',
      ctx.personal
        ? 'Included (external ids, free-text answers): handle under your data-protection rules'
        : 'Left out (your role does not read personal data)',
    ],
    ...tasteCautions.map((c, i): SummaryLine => [`Caution ${i + 1}`, c]),
  ];
}
