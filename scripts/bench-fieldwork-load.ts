/**
 * The simulated respondents of bench:fieldwork: each starts a session and answers every screen
 * in order over keep-alive fetch, timing each request; some answers are sent twice with the
 * same client id, as a phone retrying after a lost reply would.
 */
import { randomUUID } from 'node:crypto';
import { createSeededRandom } from '../server/engine/design/seeded-random';
import type { RespondentSession } from '../shared/schemas/respondent';

export type LoadMetrics = {
  answerMs: number[];
  sessionMs: number[];
  requests: number;
  uniqueAnswers: number;
  retries: number;
  replays: number;
  errors: number;
};

export function createRespondentLoad(opts: {
  base: string;
  publicId: string;
  retryShare: number;
  seed: number;
}) {
  const metrics: LoadMetrics = {
    answerMs: [],
    sessionMs: [],
    requests: 0,
    uniqueAnswers: 0,
    retries: 0,
    replays: 0,
    errors: 0,
  };
  const api = `${opts.base}/api/r/${opts.publicId}`;

  async function post(url: string, body: unknown, token?: string) {
    const t = performance.now();
    const res = await fetch(url, {
      method: 'POST',
      headers: {
        'content-type': 'application/json',
        ...(token ? { 'x-respondent-token': token } : {}),
      },
      body: JSON.stringify(body),
    });
    const json = (await res.json()) as Record<string, unknown>;
    metrics.requests++;
    return { status: res.status, json, ms: performance.now() - t };
  }

  async function runRespondent(i: number): Promise<void> {
    const random = createSeededRandom(opts.seed * 100_003 + i);
    const started = await post(`${api}/sessions`, { params: {}, device: 'bench' });
    metrics.sessionMs.push(started.ms);
    if (started.status !== 201) {
      metrics.errors++;
      return;
    }
    const session = started.json as unknown as RespondentSession;
    for (const screen of session.screens) {
      const value =
        screen.kind === 'consent'
          ? { kind: 'consent', agreed: true }
          : screen.kind === 'task'
            ? { kind: 'choice', position: random.nextInt(screen.alternatives.length) }
            : screen.kind === 'instructions'
              ? { kind: 'ack' }
              : null;
      if (!value) throw new Error(`The bench study has an unexpected ${screen.kind} screen`);
      const body = {
        clientId: randomUUID(),
        screenKey: screen.key,
        value,
        responseMs: 2000 + random.nextInt(20_000),
      };
      const first = await post(`${api}/answers`, body, session.sessionToken);
      metrics.answerMs.push(first.ms);
      if (first.status !== 201) {
        metrics.errors++;
        return;
      }
      metrics.uniqueAnswers++;
      if (random.next() < opts.retryShare) {
        metrics.retries++;
        const again = await post(`${api}/answers`, body, session.sessionToken);
        metrics.answerMs.push(again.ms);
        if (again.status === 200 && again.json.replay === true) metrics.replays++;
        else metrics.errors++;
      }
    }
  }

  return { metrics, runRespondent };
}

/** Nearest-rank percentile of a sorted list. */
function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return NaN;
  const rank = Math.max(1, Math.ceil((p / 100) * sorted.length));
  return Number(sorted[rank - 1].toFixed(1));
}

export function summarise(m: LoadMetrics, seconds: number) {
  const answers = [...m.answerMs].sort((a, b) => a - b);
  const sessions = [...m.sessionMs].sort((a, b) => a - b);
  return {
    requests: m.requests,
    requestsPerSecond: m.requests / seconds,
    answerLatency: {
      p50: percentile(answers, 50),
      p95: percentile(answers, 95),
      p99: percentile(answers, 99),
      max: percentile(answers, 100),
    },
    sessionLatency: { p50: percentile(sessions, 50), p95: percentile(sessions, 95) },
  };
}
