/**
 * A local count in front of the shared PostgreSQL counters, for the limits every respondent
 * request passes (per session token, session starts per address). Writing each hit through
 * costs one upsert per request — the busiest statement of a panel launch after the answer
 * itself — although nearly every key stays far below its limit. So each process counts a key
 * in memory while the key's known count stays within a share of its limit (its "budget"), and
 * writes through from then on: first the hits it counted on its own, then every hit, each
 * decided by the shared count exactly as before.
 *
 * What stays true: one process alone refuses exactly at the limit (its own hits are all in
 * its count); with k instances a key is refused at the latest after limit + (k − 1) × budget
 * hits in a window (the other instances' unwritten hits), and the refusal is still per key,
 * so a flood from one address or one session never locks out another. A key over its limit
 * costs the database nothing more (PostgresRateLimitStore refuses it from memory).
 */
import type { ClientRateLimitInfo, IncrementResponse, Options, Store } from 'express-rate-limit';
import type { LimitStore } from './rate-limiter';

/** What a store reads of its limiter's options (express-rate-limit's or rate-limiter.ts's). */
export type LimitOptions = Pick<Options, 'windowMs' | 'limit'>;

/** The shared counters (PostgresRateLimitStore): a store that can count several hits at once. */
export type SharedCounters = Store & {
  readonly prefix: string;
  init(options: LimitOptions): void;
  increment(key: string, hits?: number): Promise<IncrementResponse>;
  get(key: string): Promise<ClientRateLimitInfo | undefined>;
};

/** Keys counted in memory per limiter; past this, new keys are written through at once. */
export const LOCAL_KEYS_LIMIT = 50_000;

type Entry = {
  /** When this window ends (ms since the epoch). */
  resetAt: number;
  /** The shared count as the last write-through returned it. */
  shared: number;
  /** Hits counted here and not yet written. */
  pending: number;
  /** Hits being written right now. */
  writing: number;
};

export class LocalFirstRateLimitStore implements Store, LimitStore {
  readonly localKeys = false;
  private readonly entries = new Map<string, Entry>();
  private budget = 0;
  private windowMs = 60_000;

  constructor(
    private readonly shared: SharedCounters,
    /** Share of the limit (0–1) a process may count on its own before it writes through. */
    private readonly localShare: number,
    private readonly now: () => number = Date.now,
  ) {}

  get prefix(): string {
    return this.shared.prefix;
  }

  init(options: LimitOptions): void {
    this.shared.init(options);
    this.windowMs = options.windowMs;
    const limit = typeof options.limit === 'number' ? options.limit : 0;
    this.budget = Math.floor(limit * Math.min(1, Math.max(0, this.localShare)));
  }

  /** The key's entry in the current window, or null when no more keys fit in memory. */
  private entry(key: string, now: number): Entry | null {
    const found = this.entries.get(key);
    if (found && found.resetAt > now) return found;
    if (found) this.entries.delete(key);
    if (this.entries.size >= LOCAL_KEYS_LIMIT) this.sweep(now);
    if (this.entries.size >= LOCAL_KEYS_LIMIT) return null;
    const fresh = { resetAt: now + this.windowMs, shared: 0, pending: 0, writing: 0 };
    this.entries.set(key, fresh);
    return fresh;
  }

  private sweep(now: number): void {
    for (const [key, e] of this.entries)
      if (e.resetAt <= now && e.writing === 0) this.entries.delete(key);
  }

  /** Within the key's budget: counts the hit here and answers at once (no promise). */
  private countHere(e: Entry): IncrementResponse | null {
    if (e.shared + e.writing + e.pending + 1 > this.budget) return null;
    e.pending++;
    return { totalHits: e.shared + e.writing + e.pending, resetTime: new Date(e.resetAt) };
  }

  /** The hit counted in memory, or null when the shared count must decide (increment). */
  incrementNow(key: string): IncrementResponse | null {
    const e = this.entry(key, this.now());
    return e ? this.countHere(e) : null;
  }

  async increment(key: string): Promise<IncrementResponse> {
    const e = this.entry(key, this.now());
    if (!e) return this.shared.increment(key);
    const here = this.countHere(e);
    if (here) return here;
    // Near the limit: the shared count decides, with this process's unwritten hits added.
    const hits = e.pending + 1;
    e.pending = 0;
    e.writing += hits;
    try {
      const res = await this.shared.increment(key, hits);
      e.shared = Math.max(e.shared, res.totalHits);
      if (res.resetTime) e.resetAt = res.resetTime.getTime();
      return res;
    } catch (err) {
      // The hits were not written: keep them here (the limiter lets the request through).
      e.pending += hits;
      throw err;
    } finally {
      e.writing -= hits;
    }
  }

  async decrement(key: string): Promise<void> {
    const e = this.entries.get(key);
    if (e && e.pending > 0) e.pending--;
    else await this.shared.decrement(key);
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const e = this.entries.get(key);
    const stored = await this.shared.get(key);
    if (!e || e.resetAt <= this.now()) return stored;
    return {
      totalHits: (stored?.totalHits ?? 0) + e.pending,
      resetTime: stored?.resetTime ?? new Date(e.resetAt),
    };
  }

  async resetKey(key: string): Promise<void> {
    this.entries.delete(key);
    await this.shared.resetKey(key);
  }
}
