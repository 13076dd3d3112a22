/**
 * Simulated respondents for the fieldwork benchmarks. Each one arrives at its time in a ramp
 * (a panel launch), starts a session, and answers every screen in order after a short think
 * time, the way the respondent app does: an answer keeps its client id until the server has
 * acknowledged it, and is sent again after a network error, a 5xx (honouring Retry-After) or a
 * 429. Some answers are sent twice on purpose, as a phone that lost the reply would. Each
 * respondent comes from its own address (X-Forwarded-For, as a load balancer sets it) and
 * prefers one API instance, switching to the next when its instance does not answer.
 */
import { randomUUID } from 'node:crypto';
import { PhoneConnection, type PhoneReply } from './phone-connection';
import { createPrng, type Prng } from '../../server/engine/draws/prng';
import { randomIndex } from '../../server/engine/draws/random-index';
import type { RespondentScreen, RespondentSession } from '../../shared/schemas/respondent';

export type LoadOptions = {
  bases: string[];
  publicId: string;
  respondents: number;
  /** Offsets respondent numbers (addresses, seeds) so that several loads do not overlap. */
  firstRespondent: number;
  /** Arrivals spread evenly over this time. */
  rampMs: number;
  /** Mean pause before each answer (uniform between half and one and a half times it). */
  thinkMs: number;
  /** Share of acknowledged answers sent once more with the same client id. */
  retryShare: number;
  seed: number;
  /** One answer is given up (counted unsent) after trying this long. */
  giveUpMs: number;
  /**
   * This process's share when several run one load (load-client-process.ts): it simulates the
   * respondents whose number i has i % of === index, at the same arrival times as one process.
   */
  part?: { index: number; of: number };
};

export type LoadResult = {
  answerMs: number[];
  /** When each answer request of answerMs got its final reply (ms after startedAt), same order. */
  answerDoneAt: number[];
  sessionMs: number[];
  /** When each first acknowledgement of an answer arrived (ms after startedAt). */
  ackAt: number[];
  /** Each started respondent's session: from its start's reply to its last reply (ms after startedAt). */
  spans: Array<[number, number]>;
  /** Client ids the server acknowledged (2xx), with the respondent's session token. */
  acknowledged: Array<{ token: string; clientId: string; screenKey: string }>;
  unsent: number;
  replaysAsked: number;
  replaysConfirmed: number;
  errors5xx: number;
  errors429: number;
  networkErrors: number;
  /** Unexpected 4xx answers (none should happen). */
  errorsOther: Array<{ status: number; code: string }>;
  respondentsStarted: number;
  respondentsFinished: number;
  /** Longest time from a failed request to the next success anywhere in the load. */
  longestOutageMs: number;
  startedAt: number;
  endedAt: number;
  /** CPU time (user + system) of the load process(es) during the load, in ms. */
  cpuMs: number;
  /** How many processes ran the simulated respondents. */
  processes: number;
};

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** A reply not complete within this long is treated as lost (sent again). */
const REQUEST_TIMEOUT_MS = 15_000;
const START_BODY = JSON.stringify({ params: {}, device: 'bench' });

/**
 * A simulated phone: its own keep-alive connection to each instance it has used (opened at its
 * first request there and kept between answers, as a phone's browser does; one request at a
 * time), and the header lines every request of it carries (its address as a load balancer
 * gives it, and its session token once it has one).
 */
class Phone {
  private readonly connections = new Map<number, PhoneConnection>();
  private headers: string;

  constructor(
    private readonly bases: string[],
    n: number,
  ) {
    // As a phone's browser does: the session (the whole questionnaire) may come compressed.
    this.headers =
      'Content-Type: application/json\r\nAccept-Encoding: gzip, deflate, br\r\n' +
      `X-Forwarded-For: 10.${(n >> 16) & 255}.${(n >> 8) & 255}.${n & 255}\r\n`;
  }

  setToken(token: string): void {
    this.headers += `X-Respondent-Token: ${token}\r\n`;
  }

  post(instance: number, path: string, body: string): Promise<PhoneReply> {
    let c = this.connections.get(instance);
    if (!c)
      this.connections.set(
        instance,
        (c = new PhoneConnection(this.bases[instance], REQUEST_TIMEOUT_MS)),
      );
    return c.post(path, this.headers, body);
  }

  close(): void {
    for (const c of this.connections.values()) c.close();
  }
}

function valueFor(screen: RespondentScreen, random: Prng) {
  if (screen.kind === 'consent') return { kind: 'consent', agreed: true };
  if (screen.kind === 'instructions') return { kind: 'ack' };
  if (screen.kind === 'task')
    return { kind: 'choice', position: randomIndex(random, screen.alternatives.length) };
  const q = screen.question;
  if (q.type === 'single') return { kind: 'single', optionId: q.options[0]?.id ?? null };
  if (q.type === 'multiple') return { kind: 'multiple', optionIds: [q.options[0].id] };
  if (q.type === 'number') return { kind: 'number', number: q.min };
  return { kind: 'text', text: 'fine' };
}

/** A result with nothing counted yet: one process, started at `startedAt`. */
export function emptyLoadResult(startedAt: number): LoadResult {
  return {
    answerMs: [],
    answerDoneAt: [],
    sessionMs: [],
    ackAt: [],
    spans: [],
    acknowledged: [],
    unsent: 0,
    replaysAsked: 0,
    replaysConfirmed: 0,
    errors5xx: 0,
    errors429: 0,
    networkErrors: 0,
    errorsOther: [],
    respondentsStarted: 0,
    respondentsFinished: 0,
    longestOutageMs: 0,
    startedAt,
    endedAt: 0,
    cpuMs: 0,
    processes: 1,
  };
}

export async function runRespondentLoad(opts: LoadOptions): Promise<LoadResult> {
  const r = emptyLoadResult(Date.now());
  const cpuBefore = process.cpuUsage();
  let failingSince: number | null = null;
  const noteSuccess = () => {
    if (failingSince !== null)
      r.longestOutageMs = Math.max(r.longestOutageMs, Date.now() - failingSince);
    failingSince = null;
  };
  const noteFailure = () => {
    failingSince ??= Date.now();
  };

  const pathOf = (name: string) => `/api/r/${opts.publicId}${name}`;
  const sessionsPath = pathOf('/sessions');
  const answersPath = pathOf('/answers');

  const timeSession = (ms: number) => r.sessionMs.push(ms);
  const timeAnswer = (ms: number) => {
    r.answerMs.push(ms);
    r.answerDoneAt.push(Date.now() - r.startedAt);
  };

  /** One request, sent again until it gets a final answer; null when given up. */
  async function send(
    n: number,
    phone: Phone,
    path: string,
    payload: string,
    time: (ms: number) => void,
  ): Promise<{ status: number; json: Record<string, unknown> } | null> {
    const deadline = Date.now() + opts.giveUpMs;
    let instance = n % opts.bases.length;
    let attempt = 0;
    for (;;) {
      const t0 = performance.now();
      let wait = Math.min(8_000, 250 * 2 ** attempt++) * (0.5 + Math.random());
      try {
        const res = await phone.post(instance, path, payload);
        time(performance.now() - t0);
        if (res.status < 500 && res.status !== 429) {
          noteSuccess();
          return res;
        }
        noteFailure();
        if (res.status === 429) r.errors429++;
        else r.errors5xx++;
        const retryAfter = Number(res.retryAfter);
        if (retryAfter > 0) wait = retryAfter * 1000 * (0.8 + 0.4 * Math.random());
      } catch {
        // Refused, reset or timed out: try the next instance, as a load balancer would.
        noteFailure();
        r.networkErrors++;
        instance = (instance + 1) % opts.bases.length;
      }
      if (Date.now() + wait > deadline) return null;
      await sleep(wait);
    }
  }

  async function respondent(i: number) {
    const n = opts.firstRespondent + i;
    const random = createPrng(opts.seed * 100_003 + n);
    await sleep((opts.rampMs * i) / Math.max(1, opts.respondents));
    const phone = new Phone(opts.bases, n);
    try {
      await answerAll(n, random, phone);
    } finally {
      phone.close();
    }
  }

  async function answerAll(n: number, random: Prng, phone: Phone) {
    const started = await send(n, phone, sessionsPath, START_BODY, timeSession);
    if (!started) return;
    if (started.status !== 201) {
      r.errorsOther.push({
        status: started.status,
        code: String((started.json.error as { code?: string })?.code),
      });
      return;
    }
    r.respondentsStarted++;
    const span: [number, number] = [Date.now() - r.startedAt, 0];
    r.spans.push(span);
    const session = started.json as unknown as RespondentSession;
    phone.setToken(session.sessionToken);
    for (const screen of session.screens) {
      await sleep(opts.thinkMs * (0.5 + random.nextDouble()));
      const body = {
        clientId: randomUUID(),
        screenKey: screen.key,
        value: valueFor(screen, random),
        responseMs: 2000 + randomIndex(random, 20_000),
      };
      const payload = JSON.stringify(body);
      const res = await send(n, phone, answersPath, payload, timeAnswer);
      span[1] = Date.now() - r.startedAt;
      if (!res) {
        r.unsent++;
        return;
      }
      if (res.status !== 201 && !(res.status === 200 && res.json.replay === true)) {
        r.errorsOther.push({
          status: res.status,
          code: String((res.json.error as { code?: string })?.code),
        });
        return;
      }
      r.ackAt.push(span[1]);
      r.acknowledged.push({
        token: session.sessionToken,
        clientId: body.clientId,
        screenKey: screen.key,
      });
      if (res.json.status !== 'in_progress') break;
      if (random.nextDouble() < opts.retryShare) {
        r.replaysAsked++;
        const again = await send(n, phone, answersPath, payload, timeAnswer);
        if (again?.status === 200 && again.json.replay === true) r.replaysConfirmed++;
        else if (again) r.errorsOther.push({ status: again.status, code: 'replay_not_recognised' });
      }
    }
    r.respondentsFinished++;
  }

  const part = opts.part ?? { index: 0, of: 1 };
  const mine = Array.from({ length: opts.respondents }, (_, i) => i).filter(
    (i) => i % part.of === part.index,
  );
  await Promise.all(mine.map((i) => respondent(i)));
  r.endedAt = Date.now();
  const cpu = process.cpuUsage(cpuBefore);
  r.cpuMs = Math.round((cpu.user + cpu.system) / 1000);
  return r;
}
