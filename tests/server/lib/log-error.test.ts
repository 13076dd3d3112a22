/**
 * Database errors in the log: a failed query's SQL parameters (tokens, e-mail addresses) never
 * reach it, but a driver-side cause — a full pool, a dropped connection — is named, so an
 * operator can tell load from a broken query.
 */
import { describe, expect, it } from 'vitest';
import { DrizzleQueryError } from 'drizzle-orm/errors';
import pg from 'pg';
import { serializeError } from '../../../server/lib/log-error';

const SECRET = 'session-token-abc123';

describe('serializeError', () => {
  it('logs a PostgreSQL error by its codes only, never its parameters', () => {
    const cause = new pg.DatabaseError(`duplicate key (token)=(${SECRET})`, 0, 'error');
    cause.code = '23505';
    cause.constraint = 'respondents_session_token_unique';
    const err = new DrizzleQueryError('insert into respondents …', [SECRET], cause);
    const out = serializeError(err);
    expect(out).toMatchObject({ code: '23505', constraint: 'respondents_session_token_unique' });
    expect(JSON.stringify(out)).not.toContain(SECRET);
    expect(out).not.toHaveProperty('cause');
  });

  it('names a driver-side cause such as a pool timeout, still without parameters', () => {
    const cause = new Error('timeout exceeded when trying to connect');
    const err = new DrizzleQueryError('update respondent_block_counts …', [SECRET], cause);
    const out = serializeError(err);
    expect(out.cause).toEqual({
      type: 'Error',
      message: 'timeout exceeded when trying to connect',
    });
    expect(JSON.stringify(out)).not.toContain(SECRET);
  });
});
