/**
 * How long the web process's event loop makes work wait (perf_hooks.monitorEventLoopDelay),
 * reported to a parent process that asks over the IPC channel: the benchmark that started the
 * server, or the primary of a cluster of web processes (server/web-cluster.ts), which asks
 * each of its web processes and answers for all. A process without an IPC channel (started
 * by a shell or systemd) measures nothing. Why it matters: Node accepts one new connection per
 * turn of the event loop, so a loop that takes 200 ms a turn accepts five a second, however
 * many phones are waiting in the listening socket's queue.
 */
import { monitorEventLoopDelay } from 'node:perf_hooks';

/** Asks for the figures since the last question (or since the start), then starts afresh. */
export const EVENT_LOOP_DELAY_REQUEST = 'choicewright:event-loop-delay?';
export const EVENT_LOOP_DELAY_REPLY = 'choicewright:event-loop-delay';

export type EventLoopDelay = {
  /** Delays in ms of a 10 ms timer (how late it fired). */
  p50Ms: number;
  p99Ms: number;
  maxMs: number;
  /** Web processes measured (the worst p99 and max of them are given). */
  processes: number;
};

type Histogram = ReturnType<typeof monitorEventLoopDelay>;

const ms = (ns: number) => Number((ns / 1e6).toFixed(1));

/** Figures of one histogram; an empty one (no sample yet) gives zeros. */
export function summariseDelay(h: Pick<Histogram, 'count' | 'percentile' | 'max'>): EventLoopDelay {
  if (h.count === 0) return { p50Ms: 0, p99Ms: 0, maxMs: 0, processes: 1 };
  return {
    p50Ms: ms(h.percentile(50)),
    p99Ms: ms(h.percentile(99)),
    maxMs: ms(h.max),
    processes: 1,
  };
}

/** Several processes' figures as one: the worst of each (a respondent meets one process). */
export function worstDelay(parts: EventLoopDelay[]): EventLoopDelay {
  return {
    p50Ms: Math.max(0, ...parts.map((p) => p.p50Ms)),
    p99Ms: Math.max(0, ...parts.map((p) => p.p99Ms)),
    maxMs: Math.max(0, ...parts.map((p) => p.maxMs)),
    processes: parts.reduce((n, p) => n + p.processes, 0),
  };
}

type Message = { type?: unknown; delay?: EventLoopDelay };
const isRequest = (m: unknown) => (m as Message)?.type === EVENT_LOOP_DELAY_REQUEST;

/**
 * In a process started with an IPC channel: measures its event loop and answers the parent's
 * questions. Returns a stop function (a no-op without a channel).
 */
export function reportEventLoopDelay(proc: NodeJS.Process = process): () => void {
  if (!proc.send) return () => {};
  const h = monitorEventLoopDelay({ resolution: 10 });
  h.enable();
  const onMessage = (m: unknown) => {
    if (!isRequest(m)) return;
    proc.send?.({ type: EVENT_LOOP_DELAY_REPLY, delay: summariseDelay(h) });
    h.reset();
  };
  proc.on('message', onMessage);
  return () => {
    h.disable();
    proc.off('message', onMessage);
  };
}

type Channel = {
  send(message: unknown): boolean;
  on(event: 'message', fn: (m: unknown) => void): unknown;
  off(event: 'message', fn: (m: unknown) => void): unknown;
};

/** Asks one child (a forked process or a cluster worker) for its figures; null if it does not answer in time. */
export function askEventLoopDelay(
  child: Channel,
  timeoutMs = 2_000,
): Promise<EventLoopDelay | null> {
  return new Promise((resolve) => {
    const done = (d: EventLoopDelay | null) => {
      clearTimeout(timer);
      child.off('message', onMessage);
      resolve(d);
    };
    const onMessage = (m: unknown) => {
      if ((m as Message)?.type === EVENT_LOOP_DELAY_REPLY) done((m as Message).delay ?? null);
    };
    const timer = setTimeout(() => done(null), timeoutMs);
    child.on('message', onMessage);
    try {
      child.send({ type: EVENT_LOOP_DELAY_REQUEST });
    } catch {
      done(null);
    }
  });
}

/** In a cluster primary: answers its parent for all its web processes (the worst of them). */
export function relayEventLoopDelay(
  children: () => Channel[],
  proc: NodeJS.Process = process,
): () => void {
  if (!proc.send) return () => {};
  const onMessage = async (m: unknown) => {
    if (!isRequest(m)) return;
    const parts = await Promise.all(children().map((c) => askEventLoopDelay(c)));
    const delay = worstDelay(parts.filter((p): p is EventLoopDelay => p !== null));
    proc.send?.({ type: EVENT_LOOP_DELAY_REPLY, delay });
  };
  proc.on('message', onMessage);
  return () => proc.off('message', onMessage);
}
