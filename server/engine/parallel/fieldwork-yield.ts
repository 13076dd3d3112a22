/**
 * Respondents first: while fieldwork keeps the web process busy (a panel launch), an estimation
 * running on that process's engine threads waits between likelihood evaluations.
 *
 * Why not only a lower CPU priority: bench:fieldwork on the two-core reference machine showed
 * the answer p99 rising while a mixed logit computed even with its threads at nice 10 or under
 * SCHED_IDLE, and staying at its idle level when the same run was held before its first
 * evaluation (docs/methods.md, "Fieldwork before estimation"). What the engine's computing
 * costs the requests is not only CPU time (caches, memory bandwidth, V8's shared background
 * threads), so the engine stops computing instead.
 *
 * The web process owns the flag (server/lib/fieldwork-busy.ts) and passes it with each
 * estimation task; the engine thread only reads it. Waiting changes no result.
 */

/** The flag: one Int32 in a SharedArrayBuffer; BUSY while the web process is busy. */
export const BUSY = 1;
export const CALM = 0;

/** A new flag, calm, shareable with engine threads (structured clone keeps its memory). */
export function createBusyFlag(): Int32Array {
  return new Int32Array(new SharedArrayBuffer(Int32Array.BYTES_PER_ELEMENT));
}

/**
 * Blocks this (engine) thread while the flag says busy; returns the milliseconds waited. The
 * wait wakes on the flag's change (Atomics.notify) and at least every `pollMs`, so that a
 * thread ended meanwhile (a cancelled run) stops within that time.
 */
export function waitWhileBusy(flag: Int32Array, pollMs = 250): number {
  if (Atomics.load(flag, 0) !== BUSY) return 0;
  const started = performance.now();
  while (Atomics.load(flag, 0) === BUSY) Atomics.wait(flag, 0, BUSY, pollMs);
  return performance.now() - started;
}
