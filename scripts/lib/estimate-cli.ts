/**
 * The command-line estimator as a function: `scripts/estimate.ts` is its entry point, and tests
 * call it in-process (starting a process per case costs seconds of TypeScript loading; one
 * test still runs the real command for the exit code and the files). Arguments, output and
 * exit codes are documented in scripts/estimate.ts.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { parseArgs } from 'node:util';
import { ZodError } from 'zod';
import { estimationSpecSchema } from '../../shared/schemas/estimation-spec';
import { buildChoiceData } from '../../server/engine/estimation/build-choice-data';
import { ChoiceDataError } from '../../server/engine/estimation/choice-data';
import {
  EstimationFailedError,
  EstimationOptionsError,
  NonIdentifiedError,
} from '../../server/engine/estimation/estimation-errors';
import { parseChoiceCsv } from '../../server/engine/estimation/parse-choice-csv';
import { getSpecColumns, runEstimation } from '../../server/engine/estimation/run-estimation';
import { extractRespondentCovariates } from '../../server/engine/latent-class/respondent-covariates';
import { decodeText } from '../../shared/text/decode-text';

class UsageError extends Error {}

function readText(path: string, what: string): string {
  try {
    // As the app reads an upload: UTF-8, or Windows-1252 when the bytes are not UTF-8.
    return decodeText(readFileSync(path));
  } catch (error) {
    throw new UsageError(
      `cannot read the ${what} file ${path}: ${(error as NodeJS.ErrnoException).code ?? (error as Error).message}`,
    );
  }
}

async function estimateFromArgs(argv: string[], io: CliOutput): Promise<void> {
  let args;
  try {
    args = parseArgs({
      args: argv,
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
    if (!args.quiet) io.stderr(`${text}\n`);
  };
  let lastReport = 0;
  const result = await runEstimation(spec, built, {
    threads,
    onNote: (note) => io.stderr(`note: ${note}\n`),
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
  else io.stdout(text);
  if (!args.quiet) {
    const d = result.convergenceDetail;
    io.stderr(
      `done: LL ${result.loglik.toFixed(4)}, ${d?.status ?? (result.converged ? 'converged' : 'not converged')}` +
        (d
          ? ` (Newton decrement ${d.decrement?.toExponential(2) ?? '—'}, largest relative gradient ${d.maxRelativeGradient.toExponential(2)}, ${d.startsAtBest} of ${d.starts} starts at the best LL)`
          : '') +
        `, ${result.elapsedSeconds.toFixed(2)} s\n`,
    );
    if (!result.converged && d)
      for (const g of d.gradient)
        io.stderr(
          `  gradient ${g.name}: ${g.value.toExponential(3)} (relative ${g.relative.toExponential(2)})\n`,
        );
    for (const w of result.warnings ?? []) io.stderr(`warning: ${w.message}\n`);
  }
}

function describeZodError(error: ZodError): string {
  return error.issues
    .map((issue) => `specification field ${issue.path.join('.') || '(root)'}: ${issue.message}`)
    .join('\n');
}

/** Where the command writes: the process's streams, or a test's buffers. */
export interface CliOutput {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
}

/** Runs the command with `argv` (without node and the script) and returns its exit code. */
export async function runEstimateCli(argv: string[], io: CliOutput): Promise<number> {
  try {
    await estimateFromArgs(argv, io);
    return 0;
  } catch (error) {
    if (error instanceof ZodError) {
      io.stderr(`error: ${describeZodError(error)}\n`);
      return 2;
    }
    if (
      error instanceof UsageError ||
      error instanceof ChoiceDataError ||
      error instanceof EstimationOptionsError
    ) {
      io.stderr(`error: ${error.message}\n`);
      return 2;
    }
    if (error instanceof NonIdentifiedError || error instanceof EstimationFailedError) {
      io.stderr(`error: ${error.message}\n`);
      return 3;
    }
    io.stderr(`unexpected error: ${(error as Error)?.stack ?? String(error)}\n`);
    return 1;
  }
}
