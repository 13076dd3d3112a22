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

const startsInFlight = new Map<string, Promise<RespondentSession>>();

/**
 * One start request per link at a time: the early start in respond-main.tsx, React's
 * development double effects and quick remounts share it. The token is stored as soon as the
 * answer arrives, so any later start resumes this session instead of making a second respondent.
 */
export function startSessionOnce(publicId: string, search: string): Promise<RespondentSession> {
  const key = `${publicId}${search}`;
  let pending = startsInFlight.get(key);
  if (!pending) {
    pending = startSession(publicId, {
      sessionToken: readToken(publicId) ?? undefined,
      params: linkParams(search),
      device: navigator.userAgent.slice(0, 200),
    })
      .then((session) => {
        saveToken(publicId, session.sessionToken);
        return session;
      })
      .finally(() => startsInFlight.delete(key));
    startsInFlight.set(key, pending);
  }
  return pending;
}
