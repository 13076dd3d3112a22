/** Two-step sign-in on the account page: status, set-up, turning on and off, recovery codes. */
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type {
  DisableTwoStepInput,
  EnableTwoStepInput,
  RecoveryCodes,
  TwoStepSetup,
  TwoStepStatus,
} from '@shared/schemas/two-step';
import { accountKeys } from './account-keys';

export const getTwoStepQueryOptions = () =>
  queryOptions({
    queryKey: accountKeys.twoStep(),
    queryFn: ({ signal }) => api.get<TwoStepStatus>('/account/two-step', signal),
  });

export function useTwoStepStatus() {
  return useQuery(getTwoStepQueryOptions());
}

export function useStartTwoStepSetup() {
  return useMutation({ mutationFn: () => api.post<TwoStepSetup>('/account/two-step/setup') });
}

/** Turning it on ends the account's other sessions, so their list is refetched too. */
export function useEnableTwoStep() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: EnableTwoStepInput) =>
      api.post<RecoveryCodes>('/account/two-step/enable', input),
    onSuccess: () => qc.invalidateQueries({ queryKey: accountKeys.all }),
  });
}

export function useDisableTwoStep() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: DisableTwoStepInput) => api.post<void>('/account/two-step/disable', input),
    onSuccess: () => qc.invalidateQueries({ queryKey: accountKeys.twoStep() }),
  });
}

export function useRenewRecoveryCodes() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: EnableTwoStepInput) =>
      api.post<RecoveryCodes>('/account/two-step/recovery-codes', input),
    onSuccess: () => qc.invalidateQueries({ queryKey: accountKeys.twoStep() }),
  });
}
