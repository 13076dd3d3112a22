import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ForgotPasswordInput } from '@shared/schemas/auth';

export const requestPasswordReset = (input: ForgotPasswordInput) =>
  api.post<{ message: string }>('/auth/forgot-password', input);

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
