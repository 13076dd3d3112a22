/**
 * All diagnostics of a design in one plain object: D-errors, Street–Burgess D-efficiency
 * where it applies, level balance, overlap, correlations of coded columns, choice
 * probabilities under the prior means and a sample-size guide. Works on any valid design
 * (generated or imported).
 */
import { buildCodingPlan } from '../../../../shared/engine/coding/coding-plan';
import type { Design } from '../../../../shared/schemas/design';
import type { DesignPriors, DesignSpec } from '../../../../shared/schemas/design-spec';
import { getCriteriaReport } from './criteria-report';
import type { StudyDefinition } from '../../../../shared/schemas/study-definition';
import { computeDError, computeDesignCriterion, getDErrorSetup } from '../design-criteria';
import { buildDesignMatrix, getRowsPerTask, readDesignGrid } from '../design-grid';
import { computeInformationMatrix } from '../mnl-information';
import { fillLogitProbabilities } from '../../../../shared/engine/logit/logit-probabilities';
import { buildPriorDraws } from '../prior-draws';
import { resolvePriors } from '../resolve-priors';
import { invertSpd } from '../spd-inverse';
import { getAttributeOverlap } from './attribute-overlap';
import { getColumnCorrelations } from './column-correlations';
import { getLevelBalance, listUnshownLevels } from './level-balance';
import { getRuleReport } from './rule-report';
import { getLevelLabel } from '../../../../shared/study/level-labels';
import { getSampleSizeGuide } from './sample-size';
import { computeStreetBurgessEfficiency } from './street-burgess';
import type { DesignDiagnostics } from '../../../../shared/schemas/design-diagnostics';

/**
 * Computes the diagnostics; `seed` fixes the Halton scrambling of Bayesian draws; `rules` are
 * the spec's rules the design was made under (null for imported designs).
 */
export function diagnoseDesign(
  definition: StudyDefinition,
  design: Design,
  priors: DesignPriors = { kind: 'zero' },
  seed = 1,
  rules: (Pick<DesignSpec, 'dominance' | 'balance'> & Partial<DesignSpec>) | null = null,
): DesignDiagnostics {
  const plan = buildCodingPlan(definition);
  const K = plan.columnCount;
  const Jt = getRowsPerTask(plan);
  const { grid, blockOfTask } = readDesignGrid(plan, design);
  const S = grid.S;
  const x = buildDesignMatrix(plan, grid);
  const { means, sds, draws } = resolvePriors(plan, priors);
  const warnings: string[] = [];

  const dErrorZero = computeDError(K, S, Jt, x, new Float64Array(K));
  const dErrorAtMeans = priors.kind === 'zero' ? null : computeDError(K, S, Jt, x, means);
  const priorDraws = priors.kind === 'bayesian' ? buildPriorDraws(means, sds, draws, seed) : means;
  const dErrorBayesian =
    priors.kind === 'bayesian'
      ? computeDesignCriterion(getDErrorSetup(K), S, Jt, x, priorDraws, draws)
      : null;
  const dError = dErrorBayesian ?? dErrorAtMeans ?? dErrorZero;
  const finite = (v: number | null) => (v !== null && Number.isFinite(v) ? v : null);
  if (!Number.isFinite(dError))
    warnings.push('The design cannot identify every parameter (singular information matrix).');

  const info = new Float64Array(K * K);
  computeInformationMatrix(K, S, Jt, x, means, info, new Float64Array(Jt * (K + 1) + K));
  const covariance = new Float64Array(K * K);
  const invertible = invertSpd(K, info, 0, covariance, 0, new Float64Array(K * K)) > -Infinity;

  const probabilities = new Float64Array(Jt);
  const choiceProbabilities = design.tasks.map((task, s) => {
    fillLogitProbabilities(K, Jt, x, s * Jt, means, 0, probabilities, 0);
    return { task: task.task, block: task.block, probabilities: Array.from(probabilities) };
  });

  const tasksPerBlock = Array.from(
    { length: design.blocks },
    (_, b) => design.tasks.filter((t) => t.block === b + 1).length,
  );
  const levelBalance = getLevelBalance(definition, grid, blockOfTask, design.blocks);
  if (levelBalance.some((a) => a.spread > 1))
    warnings.push('Some levels appear noticeably more often than others (see level balance).');
  if (priors.kind === 'zero')
    warnings.push(
      'Zero priors: dominated alternatives cannot be recognised and the S-estimate is not available.',
    );
  const ruleReport = getRuleReport({
    definition,
    plan,
    grid,
    blockOfTask,
    blocks: design.blocks,
    means,
    sds,
    rules,
  });
  if (!ruleReport.blocks.balanced)
    warnings.push(
      'The blocks are not balanced: some level appears in a block more than one time off its fair share (see block balance).',
    );
  const errors = listUnshownLevels(definition, design).map(
    ({ attribute, level }) =>
      `${attribute.name}: the level “${getLevelLabel(attribute, level)}” never appears, so its effect cannot be estimated.`,
  );

  return {
    columns: plan.columns.map(({ key, name, kind }) => ({ key, name, kind })),
    parameters: K,
    tasks: S,
    blocks: design.blocks,
    tasksPerBlock,
    priorsKind: priors.kind,
    dError: finite(dError),
    identified: Number.isFinite(dError),
    dErrorZero: finite(dErrorZero),
    dErrorAtMeans: finite(dErrorAtMeans),
    dErrorBayesian: finite(dErrorBayesian),
    criteria: getCriteriaReport({
      plan,
      definition,
      design: { S, Jt, x },
      draws: priorDraws,
      R: priors.kind === 'bayesian' ? draws : 1,
      means,
      dError: finite(dError),
      searched: rules?.criterion ?? 'd_error',
      tValue: rules?.tValue ?? 1.96,
    }),
    dEfficiency: computeStreetBurgessEfficiency(plan, grid),
    levelBalance,
    overlap: getAttributeOverlap(definition, grid),
    correlations: getColumnCorrelations(K, Jt, plan.designedCount, S, x),
    choiceProbabilities,
    sampleSize: getSampleSizeGuide({
      columns: plan.columns,
      covarianceOne: invertible ? covariance : null,
      priorMeans: means,
      blocks: design.blocks,
      tasksPerRespondent: Math.max(...tasksPerBlock),
      alternatives: plan.designedCount,
      maxLevels: Math.max(...plan.attributes.map((a) => a.levelIds.length)),
    }),
    rules: ruleReport,
    errors,
    warnings,
  };
}
