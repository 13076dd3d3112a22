import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import type { DesignState } from '@shared/schemas/design-job';
import type { DesignDiagnostics } from '@shared/schemas/design-diagnostics';
import { designKeys } from './design-keys';

export type StudyDesignState = DesignState<DesignDiagnostics>;

const active = (s: StudyDesignState | undefined) =>
  s?.job?.status === 'queued' || s?.job?.status === 'running';

/** Polls every second while a generation job is queued or running. */
export const getDesignStateQueryOptions = (teamId: string, studyId: string) =>
  queryOptions({
    ...apiQueryOptions<StudyDesignState>(
      designKeys.state(teamId, studyId),
      `/teams/${teamId}/studies/${studyId}/design`,
    ),
    refetchInterval: (q) => (active(q.state.data) ? 1000 : false),
  });

export function useDesignState(teamId: string, studyId: string) {
  return useQuery(getDesignStateQueryOptions(teamId, studyId));
}

export const designExportHref = (teamId: string, studyId: string) =>
  `/api/teams/${teamId}/studies/${studyId}/design/export.csv`;
