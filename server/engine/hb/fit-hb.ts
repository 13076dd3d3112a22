/**
 * Hierarchical Bayes logit (Allenby & Rossi 1999; Train 2009, ch. 12): β_n = T(α_n), α_n ~ N(μ, Σ),
 * logit choices, estimated by Gibbs sampling with Metropolis–Hastings steps (run-hb-chain.ts) in
 * `chains` independent chains from MNL-based starts, then summarised (summarize-hb.ts). With
 * threads > 1 the chains run in parallel worker threads (one chain per thread at a time) and the
 * summary on a worker thread too; otherwise everything runs on the calling thread.
 */
import { fileURLToPath } from 'node:url';
import type { ChoiceData } from '../estimation/choice-data';
import { assertColumnsVary } from '../estimation/check-identification';
import { EstimationCancelledError } from '../estimation/estimation-errors';
import { selectColumns } from '../estimation/select-columns';
import { createTsWorkerPool, shareChoiceData } from '../parallel/ts-worker-pool';
import { waitWhileBusy } from '../parallel/fieldwork-yield';
import { checkHbOptions, type CheckedHbOptions, type HbOptions } from './check-hb-options';
import { getTransferables, type HbChainResult } from './hb-chain-result';
import { unwrapWorkerResult, type TransportedError } from '../parallel/engine-error-transport';
import { getHbStart } from './hb-start';
import { runHbChain } from './run-hb-chain';
import { summarizeHb, type HbSummary } from './summarize-hb';

export interface HbProgress {
  /** Iterations done by the slowest chain. */
  iteration: number;
  iterations: number;
  /** Iterations done per chain. */
  chains: number[];
}

export interface HbHooks {
  onProgress?: (progress: HbProgress) => void;
  /** Checked between progress reports; a fired signal rejects with EstimationCancelledError. */
  signal?: AbortSignal;
  /**
   * The web process's busy flag (parallel/fieldwork-yield.ts): every chain waits at its progress
   * reports while it is set. Waiting changes no draw.
   */
  fieldworkBusy?: Int32Array;
}

export interface HbResult extends HbSummary {
  options: Omit<CheckedHbOptions, 'holdout'>;
}

const WORKER_FILE = fileURLToPath(new URL('../parallel/hb-worker.ts', import.meta.url));
const POLL_MS = 500;

/** Fits the HB logit; respects hooks.signal and reports progress. */
export async function fitHb(
  data: ChoiceData,
  options: HbOptions,
  hooks: HbHooks = {},
): Promise<HbResult> {
  const opts = checkHbOptions(data, options);
  const { layout } = opts;
  const columns = [...layout.column];
  assertColumnsVary(data, columns, layout.names);
  const selected = selectColumns(data, columns);
  const holdout = opts.holdout ? selectColumns(opts.holdout, columns) : null;
  // Workers rebuild the layout from the selected columns, named as the coefficients.
  const plain: HbOptions = {
    ...options,
    coefficients: options.coefficients.map((c) => ({ ...c, column: undefined })),
    holdout: null,
  };
  const workerData = { ...selected, columns: [...layout.names] };
  const summary =
    opts.threads > 1
      ? await runInWorkers(
          shareChoiceData(workerData),
          holdout && { ...holdout, columns: [...layout.names] },
          plain,
          opts,
          hooks,
        )
      : await runInProcess(selected, holdout, opts, hooks);
  const { holdout: _unused, ...rest } = opts;
  return { ...summary, options: rest };
}

async function runInProcess(
  data: ChoiceData,
  holdout: ChoiceData | null,
  opts: CheckedHbOptions,
  hooks: HbHooks,
): Promise<HbSummary> {
  const done = new Array<number>(opts.chains).fill(0);
  const chains: HbChainResult[] = [];
  for (let c = 0; c < opts.chains; c++) {
    const start = await getHbStart(data, opts.layout, c, opts.seed);
    chains.push(
      runHbChain(data, opts, c, start, {
        onProgress: (iteration) => {
          if (hooks.fieldworkBusy) waitWhileBusy(hooks.fieldworkBusy);
          done[c] = iteration;
          hooks.onProgress?.({
            iteration: Math.min(...done),
            iterations: opts.iterations,
            chains: [...done],
          });
          return hooks.signal?.aborted === true;
        },
      }),
    );
  }
  return summarizeHb(data, holdout, opts, chains);
}

async function runInWorkers(
  data: ChoiceData,
  holdout: ChoiceData | null,
  options: HbOptions,
  opts: CheckedHbOptions,
  hooks: HbHooks,
): Promise<HbSummary> {
  const pool = createTsWorkerPool(
    WORKER_FILE,
    'handleHbMessage',
    Math.min(opts.threads, opts.chains),
  );
  const control = new Int32Array(new SharedArrayBuffer(4 * (opts.chains + 1)));
  const report = () => {
    if (hooks.signal?.aborted) Atomics.store(control, 0, 1);
    const chains = Array.from({ length: opts.chains }, (_, c) => Atomics.load(control, c + 1));
    hooks.onProgress?.({ iteration: Math.min(...chains), iterations: opts.iterations, chains });
  };
  const timer = setInterval(report, POLL_MS);
  try {
    // A chain that fails stops the others; its reason, not their "cancelled", is reported.
    const results = await Promise.all(
      Array.from({ length: opts.chains }, (_, chain) =>
        pool
          .run({ kind: 'chain', data, options, chain, control, busy: hooks.fieldworkBusy })
          .then((r: unknown) => {
            if (r && typeof r === 'object' && 'engineError' in r) Atomics.store(control, 0, 1);
            return r as HbChainResult | TransportedError;
          }),
      ),
    );
    const failure = results.find(
      (r) => 'engineError' in r && r.engineError.name !== 'EstimationCancelledError',
    );
    if (failure) unwrapWorkerResult(failure);
    if (hooks.signal?.aborted) throw new EstimationCancelledError();
    const chains = results.map((r) => unwrapWorkerResult<HbChainResult>(r));
    report();
    const summary = await pool.run(
      { kind: 'summarize', data, holdout, options, chains },
      { transferList: chains.flatMap(getTransferables) },
    );
    return unwrapWorkerResult<HbSummary>(summary);
  } finally {
    clearInterval(timer);
    await pool.destroy();
  }
}
