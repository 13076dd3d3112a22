/**
 * Worker of `npm run bench:hb`: runs one HB chain (MNL start, then the sampler) with the current
 * respondent layer (whole MH sweeps in the WebAssembly SIMD kernel) or the previous one (proposal
 * and acceptance in TypeScript, only the proposals' likelihoods in the kernel; the same chain
 * draw for draw), so that both are timed the same way in one run. Only the benchmark loads this
 * file; the app's chains run in server/engine/parallel/hb-worker.ts.
 */
import { move, transferableSymbol, valueSymbol } from 'piscina';
import type { ChoiceData } from '../../server/engine/estimation/choice-data';
import { checkHbOptions, type HbOptions } from '../../server/engine/hb/check-hb-options';
import { getTransferables } from '../../server/engine/hb/hb-chain-result';
import { getHbStart } from '../../server/engine/hb/hb-start';
import { createIndividualStep } from '../../server/engine/hb/individual-step';
import { runHbChain } from '../../server/engine/hb/run-hb-chain';

export interface HbBenchMessage {
  kernel: 'current' | 'previous';
  data: ChoiceData;
  options: HbOptions;
  chain: number;
}

export async function runBenchChain(msg: HbBenchMessage): Promise<unknown> {
  const opts = checkHbOptions(msg.data, { ...msg.options, threads: 1 });
  const start = await getHbStart(msg.data, opts.layout, msg.chain, opts.seed);
  const result = runHbChain(msg.data, opts, msg.chain, start, {}, (data, layout, alpha) =>
    createIndividualStep(data, layout, alpha, msg.kernel === 'previous' ? 'likelihood' : 'auto'),
  );
  return move({ [transferableSymbol]: getTransferables(result), [valueSymbol]: result } as never);
}
