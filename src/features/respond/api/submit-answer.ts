import { apiRequest } from '@/lib/api-client';
import { RESPONDENT_TOKEN_HEADER } from '@shared/respondent-token-header';
import type { AnswerReceipt, SubmitAnswerInput } from '@shared/schemas/respondent';

/** Sends one answer; safe to repeat with the same client id (the server stores it once). */
export function submitAnswer(
  publicId: string,
  token: string,
  answer: SubmitAnswerInput,
): Promise<AnswerReceipt> {
  return apiRequest<AnswerReceipt>(`/r/${encodeURIComponent(publicId)}/answers`, {
    method: 'POST',
    body: answer,
    headers: { [RESPONDENT_TOKEN_HEADER]: token },
  });
}
