/**
 * The middleware behind every rate limit of the API (rate-limits.ts names them): counts each
 * request under its client's key in a store, tells the client where it stands in the
 * RateLimit and RateLimit-Policy headers (IETF draft-ietf-httpapi-ratelimit-headers-08, the
 * form express-rate-limit sends with `standardHeaders: 'draft-8'`, which this replaces), and
 * refuses a key over its limit with 429 and Retry-After.
 *
 * Why not express-rate-limit itself: every answer of a panel launch passes the per-session
 * limit, and that middleware cost 4–5 % of an answer's CPU in the web process
 * (bench:fieldwork profile): it reads `req.ip` (parsing the address and the proxy chain) for
 * a debug line even when debugging is off, hashes the key with SHA-256 for the policy's
 * partition key on every request, builds the policy name anew, and awaits five times. Here
 * the name is built once per limiter, the partition key once per key (the same digest, so
 * the headers are unchanged), and a hit the store counts in memory is decided without a
 * promise (LimitStore.incrementNow).
 */
import { createHash } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import { boundedMemo } from '../lib/bounded-memo';

export type LimitHit = { totalHits: number; resetTime?: Date };

/** Where the counts live (rate-limit-store.ts, local-first-rate-limit-store.ts). */
export type LimitStore = {
  init(options: { windowMs: number; limit: number }): void;
  increment(key: string): Promise<LimitHit>;
  /** Counts the hit at once when the store can decide without I/O; null otherwise. */
  incrementNow?(key: string): LimitHit | null;
  decrement(key: string): Promise<void>;
};

export type RateLimiterOptions = {
  windowMs: number;
  limit: number;
  store: LimitStore;
  /** The client's key; requests it returns null for are not counted. */
  key: (req: Request) => string | null;
  /** Count only requests that fail (status ≥ 400), e.g. wrong passwords. */
  failuresOnly: boolean;
  /** Answers a refused request (the 429 body); the headers are set already. */
  refuse: (req: Request, res: Response) => void;
  /** The store failed: the request is let through (a database hiccup must lock nobody out). */
  onStoreError: (err: unknown) => void;
};

/** The policy's name as the headers give it, e.g. `100-in-15min` (express-rate-limit's form). */
export function policyName(limit: number, windowMs: number): string {
  const seconds = windowMs / 1000;
  const minutes = seconds / 60;
  const hours = minutes / 60;
  const days = hours / 24;
  const duration =
    seconds < 60
      ? `${seconds}sec`
      : minutes < 60
        ? `${minutes}min`
        : hours < 24
          ? `${hours}hr${hours > 1 ? 's' : ''}`
          : `${days}day${days > 1 ? 's' : ''}`;
  return `${limit}-in-${duration}`;
}

/** The policy's partition key: names the client's count without revealing its key. */
export function partitionKeyOf(key: string): string {
  const hex = createHash('sha256').update(key).digest('hex').slice(0, 12);
  return Buffer.from(hex).toString('base64');
}

/** Partition keys kept per limiter; past this the memo starts again (a session sends ~15–30). */
const PARTITION_KEYS_KEPT = 10_000;

export function createRateLimiter(o: RateLimiterOptions): RequestHandler {
  o.store.init({ windowMs: o.windowMs, limit: o.limit });
  const name = policyName(o.limit, o.windowMs);
  const windowSeconds = Math.ceil(o.windowMs / 1000);
  const partitionKey = boundedMemo(partitionKeyOf, PARTITION_KEYS_KEPT);

  const decide = (
    req: Request,
    res: Response,
    next: (err?: unknown) => void,
    key: string,
    hit: LimitHit,
  ) => {
    const resetSeconds = hit.resetTime
      ? Math.max(0, Math.ceil((hit.resetTime.getTime() - Date.now()) / 1000))
      : windowSeconds;
    if (!res.headersSent) {
      res.append(
        'RateLimit',
        `"${name}"; r=${Math.max(o.limit - hit.totalHits, 0)}; t=${resetSeconds}`,
      );
      res.append(
        'RateLimit-Policy',
        `"${name}"; q=${o.limit}; w=${windowSeconds}; pk=:${partitionKey(key)}:`,
      );
    }
    if (o.failuresOnly) {
      const resetAt = hit.resetTime?.getTime();
      res.once('finish', () => {
        if (res.statusCode >= 400 || (resetAt !== undefined && Date.now() >= resetAt)) return;
        o.store.decrement(key).catch(o.onStoreError);
      });
    }
    if (hit.totalHits > o.limit) {
      if (!res.headersSent) res.setHeader('Retry-After', String(resetSeconds));
      o.refuse(req, res);
      return;
    }
    next();
  };

  return (req, res, next) => {
    const key = o.key(req);
    if (key === null) return next();
    const now = o.store.incrementNow?.(key);
    if (now) return decide(req, res, next, key, now);
    o.store.increment(key).then(
      (hit) => {
        try {
          decide(req, res, next, key, hit);
        } catch (err) {
          next(err);
        }
      },
      (err: unknown) => {
        o.onStoreError(err);
        next();
      },
    );
  };
}
