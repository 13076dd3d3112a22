/**
 * Command-line estimation: npm run estimate -- --data choices.csv --spec spec.json [--out result.json] [--threads 2]
 * Reads long-format choice data (respondent,task,alt,chosen[,holdout] + numeric attribute
 * columns) and a specification validated by shared/schemas/estimation-spec.ts, runs the MNL
 * or the panel mixed logit with taste profiles and WTP, and writes the result JSON (to
 * stdout without --out). The result holds the convergence verdict with the gradient, the
 * warnings, and the full classical and robust covariance matrices of the estimates. Progress,
 * the verdict and the warnings also go to stderr.
 * Exit codes: 0 done; 2 bad arguments, files, data or specification (the message names the
 * line or field); 3 the model cannot be estimated from the data (not identified); 1 other.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { parseArgs } from 'node:util';
import { ZodError } from 'zod';
import { estimationSpecSchema } from '../shared/schemas/estimation-spec';
import { buildChoiceData } from '../server/engine/estimation/build-choice-data';
import { ChoiceDataError } from '../server/engine/estimation/choice-data';
import {
  EstimationOptionsError,
  NonIdentifiedError,
} from '../server/engine/estimation/estimation-errors';
import { parseChoiceCsv } from '../server/engine/estimation/parse-choice-csv';
import { getSpecColumns, runEstimation } from '../server/engine/estimation/run-estimation';

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
  const built = buildChoiceData(
    getSpecColumns(spec),
    parseChoiceCsv(readText(args.data, 'data'), getSpecColumns(spec)),
  );
  const result = await runEstimation(spec, built, {
    threads,
    onProgress: args.quiet
      ? undefined
      : (p) =>
          process.stderr.write(
            `iteration ${p.iteration}: LL ${p.loglik.toFixed(4)}, |gradient| ${p.gradientNorm.toExponential(2)}\n`,
          ),
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
  } else if (error instanceof NonIdentifiedError) {
    process.stderr.write(`error: ${error.message}\n`);
    process.exitCode = 3;
  } else {
    process.stderr.write(`unexpected error: ${(error as Error)?.stack ?? String(error)}\n`);
    process.exitCode = 1;
  }
});
