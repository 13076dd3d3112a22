/**
 * Piscina worker entry of the HB sampler. Thin by design: validate the message, call the pure
 * functions. 'chain' runs one chain (MNL start, then the sampler) and reports its iteration into
 * the shared control array, whose slot 0 asks it to stop; 'summarize' pools the chains' draws.
 * Results move (not copy) back to the caller.
 */
import { move, transferableSymbol, valueSymbol } from 'piscina';
import type { ChoiceData } from '../estimation/choice-data';
import { checkHbOptions, type HbOptions } from '../hb/check-hb-options';
import { getTransferables, type HbChainResult } from '../hb/hb-chain-result';
import { getHbStart } from '../hb/hb-start';
import { runHbChain } from '../hb/run-hb-chain';
import { summarizeHb, type HbSummary } from '../hb/summarize-hb';
import { toTransportedError } from './engine-error-transport';
import { waitWhileBusy } from './fieldwork-yield';

export type HbWorkerMessage =
  | {
      kind: 'chain';
      data: ChoiceData;
      options: HbOptions;
      chain: number;
      control: Int32Array;
      /** The web process's busy flag: the chain waits at its progress reports while it is set. */
      busy?: Int32Array;
    }
  | {
      kind: 'summarize';
      data: ChoiceData;
      holdout: ChoiceData | null;
      options: HbOptions;
      chains: HbChainResult[];
    };

export async function handleHbMessage(msg: HbWorkerMessage): Promise<unknown> {
  try {
    return await handle(msg);
  } catch (err) {
    return toTransportedError(err);
  }
}

async function handle(msg: HbWorkerMessage): Promise<unknown> {
  if (!msg || typeof msg !== 'object' || !(msg.data?.diffs instanceof Float64Array))
    throw new TypeError('invalid HB worker message');
  const opts = checkHbOptions(msg.data, { ...msg.options, threads: 1, holdout: null });
  if (msg.kind === 'chain') {
    const { control, chain, busy } = msg;
    if (
      !(control instanceof Int32Array) ||
      (busy !== undefined && !(busy instanceof Int32Array)) ||
      !Number.isInteger(chain) ||
      chain < 0 ||
      chain + 1 >= control.length
    )
      throw new TypeError('invalid HB chain message');
    const start = await getHbStart(msg.data, opts.layout, chain, opts.seed);
    const result = runHbChain(msg.data, opts, chain, start, {
      onProgress: (iteration) => {
        if (busy) waitWhileBusy(busy);
        Atomics.store(control, chain + 1, iteration);
        return Atomics.load(control, 0) !== 0;
      },
    });
    Atomics.store(control, chain + 1, opts.iterations);
    return move({ [transferableSymbol]: getTransferables(result), [valueSymbol]: result } as never);
  }
  if (msg.kind === 'summarize') {
    if (!Array.isArray(msg.chains) || msg.chains.length !== opts.chains)
      throw new TypeError('invalid HB summary message');
    return summarizeHb(msg.data, msg.holdout, opts, msg.chains) satisfies HbSummary;
  }
  throw new TypeError('unknown HB worker message');
}
