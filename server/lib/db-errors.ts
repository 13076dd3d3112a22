/**
 * Which errors mean "the database cannot be reached right now" rather than "this request is
 * wrong": the API answers those with 503 and Retry-After, so clients (the respondent app's
 * outbox, a load balancer) try again instead of giving up. A retry is always safe: writes are
 * idempotent (answers by their client id) or were rolled back with the failed transaction.
 */

/** Node socket errors of a connection that is refused, reset or unreachable. */
const SOCKET_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'EPIPE',
  'ETIMEDOUT',
  'EHOSTUNREACH',
  'ENETUNREACH',
  'EAI_AGAIN',
]);

/**
 * PostgreSQL SQLSTATEs (PostgreSQL documentation, Appendix A "Error Codes"): class 08
 * connection exception; 53300 too many connections; 57P01-57P03 shutdown, crash, cannot
 * connect now; 57014 statement cancelled (our statement timeout); 25P03 idle-in-transaction
 * timeout; 40001 serialization failure and 40P01 deadlock, which a retry resolves.
 */
const RETRYABLE_SQLSTATES = new Set([
  '53300',
  '57P01',
  '57P02',
  '57P03',
  '57014',
  '25P03',
  '40001',
  '40P01',
]);

/** Messages node-postgres uses for a connection that died or never opened. */
const CONNECTION_MESSAGES = [
  /connection terminated/i,
  /timeout exceeded when trying to connect/i,
  /not queryable/i,
  /connection (?:is )?closed/i,
  /server closed the connection unexpectedly/i,
  /terminating connection/i,
];

function causes(err: unknown): unknown[] {
  const chain: unknown[] = [];
  let e: unknown = err;
  while (e && typeof e === 'object' && chain.length < 8) {
    chain.push(e);
    e = (e as { cause?: unknown }).cause;
  }
  return chain;
}

export function isDatabaseUnavailable(err: unknown): boolean {
  return causes(err).some((e) => {
    const { code, message } = e as { code?: unknown; message?: unknown };
    if (typeof code === 'string') {
      if (SOCKET_CODES.has(code) || RETRYABLE_SQLSTATES.has(code) || code.startsWith('08'))
        return true;
    }
    if (e instanceof AggregateError && e.errors.some(isDatabaseUnavailable)) return true;
    return typeof message === 'string' && CONNECTION_MESSAGES.some((re) => re.test(message));
  });
}

/** Seconds a client should wait before trying again. */
export const DATABASE_RETRY_AFTER_SECONDS = 2;

/**
 * The unique index that refused a write (SQLSTATE 23505, unique_violation), or null for any
 * other error: callers that let an index decide a race read the winner back.
 */
export function violatedUniqueIndex(err: unknown): string | null {
  for (const e of causes(err)) {
    const { code, constraint } = e as { code?: unknown; constraint?: unknown };
    if (code === '23505') return typeof constraint === 'string' ? constraint : '';
  }
  return null;
}

/**
 * A value PostgreSQL could not read or convert (SQLSTATE class 22, data exception: a malformed
 * timestamp or number): a fault of stored data or input, never of the connection.
 */
export function isDataException(err: unknown): boolean {
  return causes(err).some((e) => {
    const { code } = e as { code?: unknown };
    return typeof code === 'string' && code.startsWith('22');
  });
}
