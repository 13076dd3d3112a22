import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { AcceptedMessage, SignUpInput } from '@shared/schemas/auth';

export const signUp = (input: SignUpInput) => api.post<AcceptedMessage>('/auth/sign-up', input);

/**
 * Asks for an account. The server answers the same way whether or not the address is taken and
 * mails a confirmation link; nobody is signed in until that link is opened.
 */
export function useSignUp() {
  return useMutation({ mutationFn: signUp });
}
