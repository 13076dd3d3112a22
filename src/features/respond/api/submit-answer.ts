import { apiRequest } from '@/lib/api-client';
import { RESPONDENT_TOKEN_HEADER } from '@shared/respondent-token-header';
import type { AnswerReceipt, SubmitAnswerInput } from '@shared/schemas/respondent';

/**
 * Sends one answer, or with `revise` a changed earlier answer; safe to repeat with the same
 * client id (the server stores it once).
 */
export function submitAnswer(
  publicId: string,
  token: string,
  answer: SubmitAnswerInput,
  revise = false,
): Promise<AnswerReceipt> {
  const route = revise ? 'revisions' : 'answers';
  return apiRequest<AnswerReceipt>(`/r/${encodeURIComponent(publicId)}/${route}`, {
    method: 'POST',
    body: answer,
    headers: { [RESPONDENT_TOKEN_HEADER]: token },
  });
}
