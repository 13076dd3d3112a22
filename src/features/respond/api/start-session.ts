import { api } from '@/lib/api-client';
import type { RespondentSession, StartSessionInput } from '@shared/schemas/respondent';
import { readToken, saveToken } from '../utils/respondent-storage';

/** Starts a session, or resumes this browser's / this personal link's earlier one. */
export function startSession(
  publicId: string,
  input: StartSessionInput,
): Promise<RespondentSession> {
  return api.post<RespondentSession>(`/r/${encodeURIComponent(publicId)}/sessions`, input);
}

function linkParams(search: string): Record<string, string> {
  const out: Record<string, string> = {};
  new URLSearchParams(search).forEach((v, k) => {
    if (Object.keys(out).length < 20) out[k.slice(0, 40)] = v.slice(0, 200);
  });
  return out;
}

type Start = { promise: Promise<RespondentSession>; claimed: boolean; settled: boolean };
const starts = new Map<string, Start>();
const keyOf = (publicId: string, search: string) => `${publicId}${search}`;

function begin(publicId: string, search: string, claimed: boolean): Start {
  const key = keyOf(publicId, search);
  const entry: Start = {
    claimed,
    settled: false,
    promise: startSession(publicId, {
      sessionToken: readToken(publicId) ?? undefined,
      params: linkParams(search),
      device: navigator.userAgent.slice(0, 200),
    }).then((session) => {
      saveToken(publicId, session.sessionToken);
      return session;
    }),
  };
  starts.set(key, entry);
  const drop = () => {
    if (starts.get(key) === entry) starts.delete(key);
  };
  entry.promise.then(
    () => {
      entry.settled = true;
      if (entry.claimed) drop();
    },
    // A failed start is never reused: the app's own call asks again and shows the reason.
    drop,
  );
  return entry;
}

/**
 * The boot script's early start (src/respond-boot.ts), sent while React is still on its way.
 * Its answer is kept until the app claims it, so the app does not pay a second round trip
 * when the session arrives before the app has loaded (the usual case on a slow connection).
 */
export function prefetchSession(publicId: string, search: string): Promise<RespondentSession> {
  return (starts.get(keyOf(publicId, search)) ?? begin(publicId, search, false)).promise;
}

/**
 * One start request per link at a time: the early start, React's development double effects
 * and quick remounts share it. The token is stored as soon as the answer arrives, so any later
 * start resumes this session instead of making a second respondent.
 */
export function startSessionOnce(publicId: string, search: string): Promise<RespondentSession> {
  const key = keyOf(publicId, search);
  const entry = starts.get(key);
  if (!entry) return begin(publicId, search, true).promise;
  if (!entry.claimed) {
    entry.claimed = true;
    if (entry.settled) starts.delete(key);
  }
  return entry.promise;
}
