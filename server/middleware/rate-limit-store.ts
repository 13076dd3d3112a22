/**
 * The counter store behind every rate limiter (rate-limiter.ts): PostgreSQL, so that all API
 * instances behind a load balancer share one count per client. The counting itself is done by
 * the maintained rate-limiter-flexible package (RateLimiterPostgres: one INSERT … ON CONFLICT
 * per hit, a named prepared statement) on our own pool; this file only adapts it to
 * the limiter's store interface (express-rate-limit's Store, whose types it keeps).
 *
 * Cost on the hot respondent path: the table (migration 0003) is UNLOGGED — no write-ahead log
 * — so a hit is one short upsert; keys are hashed, spreading rows (no hot row per study); and a
 * key over its limit is then refused from memory until its window ends, so a flood costs the
 * database nothing more. `npm run bench:rate-limit` measures it beside the in-memory store.
 * Keys are SHA-256 digests: the table never holds a session token, link token or address.
 */
import { createHash } from 'node:crypto';
import type pg from 'pg';
import type { Store, IncrementResponse, ClientRateLimitInfo } from 'express-rate-limit';
import type { LimitStore } from './rate-limiter';
import type { LimitOptions } from './local-first-rate-limit-store';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';

export const RATE_LIMIT_TABLE = 'rate_limit_counters';

const digest = (key: string) => createHash('sha256').update(key).digest('base64url').slice(0, 32);

export class PostgresRateLimitStore implements Store, LimitStore {
  readonly localKeys = false;
  private limiter: RateLimiterPostgres | null = null;
  private limit = 1;
  private windowMs = 60_000;

  constructor(
    private readonly pool: pg.Pool,
    /** Names the limiter; two limiters never share counts. */
    readonly prefix: string,
  ) {}

  init(options: LimitOptions): void {
    if (typeof options.limit !== 'number')
      throw new Error('PostgresRateLimitStore needs a numeric limit');
    this.limit = options.limit;
    this.windowMs = options.windowMs;
    this.limiter = new RateLimiterPostgres({
      storeClient: this.pool,
      storeType: 'pool',
      tableName: RATE_LIMIT_TABLE,
      tableCreated: true,
      keyPrefix: this.prefix,
      points: options.limit,
      duration: Math.ceil(options.windowMs / 1000),
      // Once over the limit, refuse from memory until the window ends (floods skip the DB).
      inMemoryBlockOnConsumed: options.limit + 1,
    });
  }

  private get rl(): RateLimiterPostgres {
    if (!this.limiter) throw new Error('rate-limit store used before init');
    return this.limiter;
  }

  private info(res: RateLimiterRes): IncrementResponse {
    const overLimit = res.remainingPoints === 0 && res.consumedPoints === 0;
    return {
      totalHits: overLimit ? this.limit + 1 : res.consumedPoints,
      resetTime: new Date(Date.now() + (res.msBeforeNext > 0 ? res.msBeforeNext : this.windowMs)),
    };
  }

  /** Counts `hits` hits of the key at once (LocalFirstRateLimitStore writes several through). */
  async increment(key: string, hits = 1): Promise<IncrementResponse> {
    try {
      return this.info(await this.rl.consume(digest(key), hits));
    } catch (err) {
      if (err instanceof RateLimiterRes) return this.info(err);
      throw err;
    }
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const res = await this.rl.get(digest(key));
    return res ? this.info(res) : undefined;
  }

  async decrement(key: string): Promise<void> {
    await this.rl.reward(digest(key), 1);
  }

  async resetKey(key: string): Promise<void> {
    await this.rl.delete(digest(key));
  }
}
