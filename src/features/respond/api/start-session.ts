import { api } from '@/lib/api-client';
import type { RespondentSession, StartSessionInput } from '@shared/schemas/respondent';

/** Starts a session, or resumes this browser's / this personal link's earlier one. */
export function startSession(
  publicId: string,
  input: StartSessionInput,
): Promise<RespondentSession> {
  return api.post<RespondentSession>(`/r/${encodeURIComponent(publicId)}/sessions`, input);
}
