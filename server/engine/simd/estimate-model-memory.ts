/**
 * Memory a mixed-logit run needs, from its dimensions alone (before any data are loaded):
 * the estimation arena (data once, every respondent's single-precision variates, per-thread
 * workspaces; arena-plan.ts), the taste-profile arena (one chunk of respondents per thread),
 * per-respondent scores (held by the workers and the caller), the P × P matrices of the
 * optimiser and the covariances, and the profiles returned. Used to refuse a specification
 * that cannot fit before it is queued.
 */
import { planArena, type ArenaDimensions } from './arena-plan';

export interface ModelMemoryInput extends Omit<ArenaDimensions, 'draws'> {
  /** Estimation draws R and profile draws per respondent. */
  draws: number;
  profileDraws: number;
  /** Most difference rows of one respondent. */
  maxRows: number;
  threads: number;
}

/** Respondents whose profile draws a thread holds at once (taste-profiles.ts PROFILE_CHUNK). */
const PROFILE_CHUNK = 64;
/** Rough size of one stored number in a profile object (key, boxed value, map overhead). */
const PROFILE_VALUE_BYTES = 48;

/** Estimated bytes of engine memory for a run of these dimensions. */
export function estimateModelMemory(m: ModelMemoryInput): number {
  const threads = Math.max(1, Math.min(m.threads, m.respondents));
  const per = Math.ceil(m.respondents / threads);
  const slices = (variates: (count: number) => number) =>
    Array.from({ length: threads }, (_, i) => {
      const count = Math.max(0, Math.min(per, m.respondents - i * per));
      return { first: i * per, count, maxRows: m.maxRows, variateRespondents: variates(count) };
    });
  const estimation = planArena(
    { ...m, draws: m.draws },
    slices((count) => count),
  ).bytes;
  const profiles = planArena(
    { ...m, draws: m.profileDraws },
    slices((count) => Math.min(PROFILE_CHUNK, count)),
  ).bytes;
  const scores = 3 * 8 * m.respondents * m.P;
  const matrices = 8 * 8 * m.P * m.P;
  const profileResults = m.respondents * (3 * m.K + 1) * (8 + PROFILE_VALUE_BYTES);
  return estimation + profiles + scores + matrices + profileResults;
}
