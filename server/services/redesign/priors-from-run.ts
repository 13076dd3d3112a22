/**
 * A finished MNL or mixed-logit run's estimates as Bayesian priors for a new design: for every
 * coded column of the study's current attributes, a normal prior with the estimated population
 * mean as its mean and, as its SD, the standard error of that mean or (mixed logit, on request)
 * the population SD of the random coefficient. Updating priors from a pilot this way is common
 * practice (Bliemer & Rose, "Experimental design influences on stated choice outputs", 2011,
 * from memory; docs/methods.md, "Priors from a run"). The off-diagonal covariance is not
 * used: the design engine's priors are independent normals.
 *
 * The run must code the attributes as the study does now (same coded columns, same level
 * codes); otherwise its coefficients mean something else and the priors are refused.
 */
import { getCodedColumns } from '../../../shared/engine/coding/coded-columns';
import { getAttributeCodes } from '../../../shared/engine/coding/level-codes';
import type { Run } from '../../../shared/schemas/run';
import type { PriorSpread, RunPriorColumn, RunPriors } from '../../../shared/schemas/redesign';
import type { StudyDefinition } from '../../../shared/schemas/study-definition';
import { ConflictError, ValidationError } from '../../lib/errors';

/** Prior draws of the Bayesian criterion (the design form's default). */
const PRIOR_DRAWS = 200;

const refuse = (path: 'runId' | 'spread', message: string, code = 'invalid_priors_source') =>
  new ValidationError(message, [{ path, message }], code);

/** Level codes of an attribute as a comparable string (coding, ids and numbers). */
function codingOf(definition: StudyDefinition, attributeId: string): string | null {
  const attribute = definition.attributes.find((a) => a.id === attributeId);
  if (!attribute) return null;
  const codes = getAttributeCodes(attribute);
  return JSON.stringify([attribute.coding, codes.levelIds, Array.from(codes.codes)]);
}

/** Throws when the run's columns or level codes differ from the study's current ones. */
function assertSameCoding(run: Run, runDefinition: StudyDefinition, current: StudyDefinition) {
  const runKeys = new Set((run.results?.columns ?? []).map((c) => c.key));
  const columns = getCodedColumns(current);
  const missing = columns.filter((c) => !runKeys.has(c.key)).map((c) => c.name);
  const currentKeys = new Set(columns.map((c) => c.key));
  const extra = (run.results?.columns ?? []).filter((c) => !currentKeys.has(c.key));
  const problems: string[] = [];
  if (missing.length > 0) problems.push(`the run has no coefficient for ${missing.join(', ')}`);
  if (extra.length > 0)
    problems.push(
      `the study no longer has ${extra.map((c) => c.label).join(', ')}, which the run estimated`,
    );
  const recoded = current.attributes
    .filter((a) => codingOf(runDefinition, a.id) !== codingOf(current, a.id))
    .map((a) => a.name);
  if (recoded.length > 0 && missing.length === 0 && extra.length === 0)
    problems.push(`${recoded.join(', ')} ${recoded.length === 1 ? 'is' : 'are'} coded differently`);
  if (problems.length > 0)
    throw refuse(
      'runId',
      `This run's coding does not match the study's current attributes: ${problems.join('; ')}. Estimate a model with the current attributes first.`,
      'coding_mismatch',
    );
}

/**
 * Standard error of a coefficient's population mean, or null when the run has none. The MNL
 * names its parameters by data column, the mixed logit by coefficient ("x", "x.mean"), so both
 * names are tried; the SE is the one the run reports (robust when its covariance is robust).
 */
function getMeanSe(run: Run, coefficient: string, key: string): number | null {
  const results = run.results!;
  const names = [coefficient, key];
  const distribution = run.spec.coefficients.find((c) => c.name === coefficient)?.distribution;
  if (distribution === 'lognormal' || distribution === 'neg_lognormal')
    return (
      results.derived?.find((d) => names.includes(d.name) && d.quantity === 'mean')?.se ?? null
    );
  const parameters =
    !distribution || distribution === 'fixed' ? names : names.map((n) => `${n}.mean`);
  const estimate = results.estimates.find((e) => parameters.includes(e.name));
  if (!estimate) return null;
  return results.covariance?.used === 'robust'
    ? (estimate.robustSe ?? estimate.se)
    : (estimate.se ?? estimate.robustSe);
}

/** Builds the priors; throws ValidationError / ConflictError with the field to fix. */
export function buildPriorsFromRun(input: {
  run: Run;
  /** The definition the run coded its data with (its latest version's). */
  runDefinition: StudyDefinition;
  /** The study's attributes now, which the new design will use. */
  current: StudyDefinition;
  spread: PriorSpread;
}): RunPriors {
  const { run, runDefinition, current, spread } = input;
  if (run.status !== 'done' || !run.results)
    throw new ConflictError('run_not_finished', 'Only a finished run can give priors.');
  if (run.model !== 'mnl' && run.model !== 'mixed')
    throw refuse('runId', 'Priors come from a multinomial or mixed logit run.');
  if (run.spec.space === 'wtp')
    throw refuse(
      'runId',
      'A run in WTP space estimates WTP, not coefficients: use a preference-space run.',
    );
  if (spread === 'population' && run.model !== 'mixed')
    throw refuse(
      'spread',
      'A multinomial logit has no population spread; use the standard errors.',
    );
  assertSameCoding(run, runDefinition, current);
  const byKey = new Map(run.results.columns.map((c) => [c.key, c]));
  const columns = getCodedColumns(current).map((column): RunPriorColumn => {
    const coefficient = byKey.get(column.key)!.coefficient;
    const moment = run.results!.population.find((p) => p.name === coefficient);
    const mean =
      moment?.mean ?? run.results!.estimates.find((e) => e.name === coefficient)?.estimate;
    const random = moment !== undefined && moment.distribution !== 'fixed';
    const spreadFrom: PriorSpread = spread === 'population' && random ? 'population' : 'se';
    const sd = spreadFrom === 'population' ? moment!.sd : getMeanSe(run, coefficient, column.key);
    if (mean === undefined || !Number.isFinite(mean) || sd === null || !Number.isFinite(sd))
      throw refuse(
        'runId',
        `The run has no usable ${mean === undefined ? 'estimate' : 'standard error'} for ${column.name}; choose a run that converged with standard errors.`,
      );
    return { key: column.key, name: column.name, coefficient, mean, sd, spreadFrom };
  });
  return {
    runId: run.id,
    runName: run.name,
    model: run.model,
    spread,
    priors: {
      kind: 'bayesian',
      columns: columns.map(({ key, mean, sd }) => ({ key, mean, sd })),
      draws: PRIOR_DRAWS,
    },
    columns,
  };
}
