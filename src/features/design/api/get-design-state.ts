import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { DesignState } from '@shared/schemas/design-job';
import type { DesignDiagnostics } from '@shared/schemas/design-diagnostics';
import { designKeys } from './design-keys';

export type StudyDesignState = DesignState<DesignDiagnostics>;

export function getDesignState(teamId: string, studyId: string, signal?: AbortSignal) {
  return api.get<StudyDesignState>(`/teams/${teamId}/studies/${studyId}/design`, signal);
}

const active = (s: StudyDesignState | undefined) =>
  s?.job?.status === 'queued' || s?.job?.status === 'running';

/** Polls every second while a generation job is queued or running. */
export const getDesignStateQueryOptions = (teamId: string, studyId: string) =>
  queryOptions({
    queryKey: designKeys.state(teamId, studyId),
    queryFn: ({ signal }) => getDesignState(teamId, studyId, signal),
    refetchInterval: (q) => (active(q.state.data) ? 1000 : false),
  });

export function useDesignState(teamId: string, studyId: string) {
  return useQuery(getDesignStateQueryOptions(teamId, studyId));
}

export const designExportHref = (teamId: string, studyId: string) =>
  `/api/teams/${teamId}/studies/${studyId}/design/export.csv`;
