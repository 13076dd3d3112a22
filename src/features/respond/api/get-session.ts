import { apiRequest } from '@/lib/api-client';
import { RESPONDENT_TOKEN_HEADER } from '@shared/respondent-token-header';
import type { RespondentSession } from '@shared/schemas/respondent';

/** The session as the server has it: which screens are answered, and the status. */
export function getSession(publicId: string, token: string): Promise<RespondentSession> {
  return apiRequest<RespondentSession>(`/r/${encodeURIComponent(publicId)}/session`, {
    headers: { [RESPONDENT_TOKEN_HEADER]: token },
  });
}
