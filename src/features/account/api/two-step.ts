/** Two-step sign-in on the account page: status, set-up, turning on and off, recovery codes. */
import { queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import { useRefreshingMutation } from '@/hooks/use-refreshing-mutation';
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
  return useRefreshingMutation(
    (input: EnableTwoStepInput) => api.post<RecoveryCodes>('/account/two-step/enable', input),
    accountKeys.all,
  );
}

export function useDisableTwoStep() {
  return useRefreshingMutation(
    (input: DisableTwoStepInput) => api.post<void>('/account/two-step/disable', input),
    accountKeys.twoStep(),
  );
}

export function useRenewRecoveryCodes() {
  return useRefreshingMutation(
    (input: EnableTwoStepInput) =>
      api.post<RecoveryCodes>('/account/two-step/recovery-codes', input),
    accountKeys.twoStep(),
  );
}
