import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ShareResult, SimulateSharesInput } from '@shared/schemas/shares';

/** Simulates shares of a scenario (a read: nothing is stored, so nothing to invalidate). */
export function simulateShares(teamId: string, studyId: string, input: SimulateSharesInput) {
  return api.post<ShareResult>(`/teams/${teamId}/studies/${studyId}/shares/simulate`, input);
}

export function useSimulateShares(teamId: string, studyId: string) {
  return useMutation({
    mutationFn: (input: SimulateSharesInput) => simulateShares(teamId, studyId, input),
  });
}
