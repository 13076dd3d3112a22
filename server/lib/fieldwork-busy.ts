/**
 * Whether the web process is busy with requests, for the embedded worker's estimation threads
 * (server/engine/parallel/fieldwork-yield.ts explains why they wait). Every SAMPLE_MS this
 * process's event-loop utilisation over the last sample (node:perf_hooks) is compared with the
 * threshold (ENGINE_YIELD_UTILISATION): at or above it the flag turns busy at once; it turns
 * calm again only after CALM_MS below it, so that an estimation does not start and stop
 * between the bursts of a launch.
 */
import { performance, type EventLoopUtilization } from 'node:perf_hooks';
import { BUSY, CALM, createBusyFlag } from '../engine/parallel/fieldwork-yield';

export const SAMPLE_MS = 100;
export const CALM_MS = 1_000;

export type BusyState = { busy: boolean; calmSince: number | null };

/** The next state after a sample of `utilisation` (0–1) at time `now` (ms). */
export function nextBusyState(
  state: BusyState,
  utilisation: number,
  now: number,
  options: { threshold: number; calmMs?: number },
): BusyState {
  if (utilisation >= options.threshold) return { busy: true, calmSince: null };
  if (!state.busy) return state;
  const calmSince = state.calmSince ?? now;
  return now - calmSince >= (options.calmMs ?? CALM_MS)
    ? { busy: false, calmSince: null }
    : { busy: true, calmSince };
}

/**
 * Starts sampling; `flag` is what the estimation tasks carry. The timer does not keep the
 * process alive; stop() ends it and leaves the flag calm.
 */
export function startFieldworkBusySignal(options: { threshold: number }): {
  flag: Int32Array;
  stop(): void;
} {
  const flag = createBusyFlag();
  let state: BusyState = { busy: false, calmSince: null };
  let last: EventLoopUtilization = performance.eventLoopUtilization();
  const timer = setInterval(() => {
    const now = performance.eventLoopUtilization();
    const sample = performance.eventLoopUtilization(now, last);
    last = now;
    const next = nextBusyState(state, sample.utilization, performance.now(), options);
    if (next.busy !== state.busy) {
      Atomics.store(flag, 0, next.busy ? BUSY : CALM);
      if (!next.busy) Atomics.notify(flag, 0);
    }
    state = next;
  }, SAMPLE_MS);
  timer.unref();
  return {
    flag,
    stop() {
      clearInterval(timer);
      Atomics.store(flag, 0, CALM);
      Atomics.notify(flag, 0);
    },
  };
}
