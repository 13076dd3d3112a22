import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CurrentUser, SignInInput } from '@shared/schemas/auth';
import type { SecondStepInput, SignInResult } from '@shared/schemas/two-step';
import { useSessionChange } from '../hooks/use-session-change';

export const signIn = (input: SignInInput) => api.post<SignInResult>('/auth/sign-in', input);

/** A right password either signs in or, with two-step sign-in on, asks for the code next. */
export function useSignIn() {
  const changeSession = useSessionChange();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (result) => {
      if ('twoStepRequired' in result) return;
      changeSession(result);
    },
  });
}

export const finishSignIn = (input: SecondStepInput) =>
  api.post<CurrentUser>('/auth/sign-in/second-step', input);

export function useSecondStep() {
  const changeSession = useSessionChange();
  return useMutation({ mutationFn: finishSignIn, onSuccess: changeSession });
}
