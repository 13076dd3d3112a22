/**
 * Background priority for engine threads. Design and estimation threads call this first, so
 * that on a busy machine the operating system serves the web process's request thread (and
 * PostgreSQL) before them: a long estimation then slows itself, not the respondents.
 * Threads they start (the mixed logit's slices) inherit the priority.
 *
 * Linux keeps a nice value per thread; /proc/thread-self names this thread's id, and
 * setpriority(PRIO_PROCESS, tid) (os.setPriority) changes this thread only (see the Linux
 * man pages setpriority(2) and proc(5)). Elsewhere this does nothing.
 */
import fs from 'node:fs';
import os from 'node:os';
import { isMainThread, workerData } from 'node:worker_threads';

/** Nice value of engine threads by default: well below interactive work, above idle-only. */
export const ENGINE_THREAD_NICE = 10;

/** What a pool passes to its threads (piscina's workerData). */
export type EngineThreadData = { nice?: number };

export function lowerThreadPriority(
  nice = (workerData as EngineThreadData | undefined)?.nice ?? ENGINE_THREAD_NICE,
): boolean {
  // Never on a main thread: that would slow the whole process's request handling.
  if (isMainThread || process.platform !== 'linux') return false;
  try {
    const tid = Number(fs.readlinkSync('/proc/thread-self').split('/').pop());
    if (!Number.isInteger(tid) || tid <= 0) return false;
    if (nice > 0 && os.getPriority(tid) < nice) os.setPriority(tid, nice);
    return true;
  } catch {
    return false;
  }
}
