import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { useSessionChange } from '../hooks/use-session-change';

export const signOut = () => api.post<void>('/auth/sign-out');

export function useSignOut() {
  const changeSession = useSessionChange();
  return useMutation({ mutationFn: signOut, onSuccess: () => changeSession(null) });
}
