import { apiRequest } from '@/lib/api-client';
import { RESPONDENT_TOKEN_HEADER } from '@shared/respondent-token-header';
import type { RespondentSession } from '@shared/schemas/respondent';

/** The respondent's language choice on the first screen; answers with the session in it. */
export function chooseLanguage(
  publicId: string,
  token: string,
  language: string,
): Promise<RespondentSession> {
  return apiRequest<RespondentSession>(`/r/${encodeURIComponent(publicId)}/language`, {
    method: 'POST',
    body: { language },
    headers: { [RESPONDENT_TOKEN_HEADER]: token },
  });
}
