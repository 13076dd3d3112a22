/**
 * Command-line estimation: npm run estimate -- --data choices.csv --spec spec.json [--out result.json] [--threads 2]
 * Reads long-format choice data (respondent,task,alt,chosen[,holdout] + numeric attribute
 * columns, and for a latent class model with `membership` the named respondent-level columns)
 * and a specification validated by shared/schemas/estimation-spec.ts, runs the MNL, the panel
 * mixed logit, hierarchical Bayes (model "hb") or the latent class logit (model "latent_class")
 * with individual estimates and WTP, and writes the result JSON (to stdout without --out). The
 * result holds the convergence verdict with the gradient (HB: the sampler's diagnostics), the
 * warnings, and for MNL and mixed logit the full classical and robust covariance matrices.
 * Progress, the verdict and the warnings also go to stderr.
 * Exit codes: 0 done; 2 bad arguments, files, data or specification (the message names the
 * line or field); 3 the model cannot be estimated from the data (not identified, a diverging
 * chain, an empty class); 1 other.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { parseArgs } from 'node:util';
import { ZodError } from 'zod';
import { estimationSpecSchema } from '../shared/schemas/estimation-spec';
import { buildChoiceData } from '../server/engine/estimation/build-choice-data';
import { ChoiceDataError } from '../server/engine/estimation/choice-data';
import {
  EstimationFailedError,
  EstimationOptionsError,
  NonIdentifiedError,
} from '../server/engine/estimation/estimation-errors';
import { parseChoiceCsv } from '../server/engine/estimation/parse-choice-csv';
import { getSpecColumns, runEstimation } from '../server/engine/estimation/run-estimation';
import { extractRespondentCovariates } from '../server/engine/latent-class/respondent-covariates';

class UsageError extends Error {}

function readText(path: string, what: string): string {
  try {
    return readFileSync(path, 'utf8');
  } catch (error) {
    throw new UsageError(
      `cannot read the ${what} file ${path}: ${(error as NodeJS.ErrnoException).code ?? (error as Error).message}`,
    );
  }
}

async function main(): Promise<void> {
  let args;
  try {
    args = parseArgs({
      options: {
        data: { type: 'string' },
        spec: { type: 'string' },
        out: { type: 'string' },
        threads: { type: 'string' },
        quiet: { type: 'boolean' },
      },
    }).values;
  } catch (error) {
    throw new UsageError((error as Error).message);
  }
  if (!args.data || !args.spec)
    throw new UsageError(
      'usage: npm run estimate -- --data choices.csv --spec spec.json [--out result.json] [--threads N]',
    );
  const threads = args.threads === undefined ? 1 : Number(args.threads);
  if (!Number.isInteger(threads) || threads < 1 || threads > 64)
    throw new UsageError('--threads must be an integer between 1 and 64');
  let specJson: unknown;
  try {
    specJson = JSON.parse(readText(args.spec, 'specification'));
  } catch (error) {
    if (error instanceof UsageError) throw error;
    throw new UsageError(`the specification is not valid JSON: ${(error as Error).message}`);
  }
  const spec = estimationSpecSchema.parse(specJson);
  const columns = getSpecColumns(spec);
  const membershipColumns = spec.model === 'latent_class' ? (spec.membership ?? []) : [];
  const rows = parseChoiceCsv(readText(args.data, 'data'), [...columns, ...membershipColumns]);
  const built = buildChoiceData(
    columns,
    rows.map((r) => ({ ...r, values: Array.prototype.slice.call(r.values, 0, columns.length) })),
  );
  const say = (text: string) => {
    if (!args.quiet) process.stderr.write(`${text}\n`);
  };
  let lastReport = 0;
  const result = await runEstimation(spec, built, {
    threads,
    onNote: (note) => process.stderr.write(`note: ${note}\n`),
    membership:
      membershipColumns.length > 0
        ? extractRespondentCovariates(
            rows,
            membershipColumns,
            columns.length,
            built.data.respondentIds,
          )
        : null,
    onProgress: (p) =>
      say(
        `iteration ${p.iteration}: LL ${p.loglik.toFixed(4)}, |gradient| ${p.gradientNorm.toExponential(2)}`,
      ),
    onSamplerProgress: (p) => {
      if (Date.now() - lastReport < 2000) return;
      lastReport = Date.now();
      say(
        `sampling: iteration ${p.iteration} of ${p.iterations} (chains at ${p.chains.join(', ')})`,
      );
    },
    onClassProgress: (p) =>
      say(`latent class: ${p.classes} classes, start ${p.start} of ${p.starts}`),
  });
  const text = `${JSON.stringify(result, null, 2)}\n`;
  if (args.out) writeFileSync(args.out, text);
  else process.stdout.write(text);
  if (!args.quiet) {
    const d = result.convergenceDetail;
    process.stderr.write(
      `done: LL ${result.loglik.toFixed(4)}, ${d?.status ?? (result.converged ? 'converged' : 'not converged')}` +
        (d
          ? ` (Newton decrement ${d.decrement?.toExponential(2) ?? '—'}, largest relative gradient ${d.maxRelativeGradient.toExponential(2)}, ${d.startsAtBest} of ${d.starts} starts at the best LL)`
          : '') +
        `, ${result.elapsedSeconds.toFixed(2)} s\n`,
    );
    if (!result.converged && d)
      for (const g of d.gradient)
        process.stderr.write(
          `  gradient ${g.name}: ${g.value.toExponential(3)} (relative ${g.relative.toExponential(2)})\n`,
        );
    for (const w of result.warnings ?? []) process.stderr.write(`warning: ${w.message}\n`);
  }
}

function describeZodError(error: ZodError): string {
  return error.issues
    .map((issue) => `specification field ${issue.path.join('.') || '(root)'}: ${issue.message}`)
    .join('\n');
}

main().catch((error: unknown) => {
  if (error instanceof ZodError) {
    process.stderr.write(`error: ${describeZodError(error)}\n`);
    process.exitCode = 2;
  } else if (
    error instanceof UsageError ||
    error instanceof ChoiceDataError ||
    error instanceof EstimationOptionsError
  ) {
    process.stderr.write(`error: ${error.message}\n`);
    process.exitCode = 2;
  } else if (error instanceof NonIdentifiedError || error instanceof EstimationFailedError) {
    process.stderr.write(`error: ${error.message}\n`);
    process.exitCode = 3;
  } else {
    process.stderr.write(`unexpected error: ${(error as Error)?.stack ?? String(error)}\n`);
    process.exitCode = 1;
  }
});
