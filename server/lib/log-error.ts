/**
 * How errors are written to the log. A failed Drizzle query carries its SQL parameters in its
 * message and stack (session tokens, e-mail addresses…), and PostgreSQL's `detail` quotes the
 * offending values; so a database error is logged by its codes only, never by its values.
 */
type PgLike = {
  code?: string;
  constraint?: string;
  table?: string;
  column?: string;
  routine?: string;
};

/** The stack's call frames only: its head repeats the (possibly value-bearing) message. */
function framesOf(err: Error): string | undefined {
  return err.stack
    ?.split('\n')
    .filter((line) => /^\s+at /.test(line))
    .join('\n');
}

function isQueryError(err: Error): boolean {
  return 'query' in err && 'params' in err;
}

function isDatabaseError(err: unknown): err is Error & PgLike {
  return err instanceof Error && err.constructor.name === 'DatabaseError';
}

export function serializeError(err: unknown): Record<string, unknown> {
  if (!(err instanceof Error)) return { type: typeof err, message: 'non-error value thrown' };
  const db =
    isQueryError(err) && isDatabaseError(err.cause) ? err.cause : isDatabaseError(err) ? err : null;
  if (isQueryError(err) || db) {
    return {
      type: err.constructor.name,
      message: 'Database query failed (parameters withheld from the log)',
      code: db?.code,
      constraint: db?.constraint,
      table: db?.table,
      column: db?.column,
      routine: db?.routine,
      // A cause that is not a PostgreSQL error comes from the driver or the pool (a connect
      // timeout, a dropped connection): its message names no query values, and without it the
      // log could not tell a full pool from a broken query.
      ...(!db && err.cause instanceof Error
        ? { cause: { type: err.cause.constructor.name, message: err.cause.message } }
        : {}),
      stack: framesOf(err),
    };
  }
  const out: Record<string, unknown> = {
    type: err.constructor.name,
    message: err.message,
    stack: err.stack,
  };
  const code = (err as { code?: unknown }).code;
  if (typeof code === 'string') out.code = code;
  if (err.cause instanceof Error) out.cause = serializeError(err.cause);
  return out;
}
