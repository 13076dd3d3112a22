import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ExportManifest } from '@shared/schemas/exports';

export const exportKeys = {
  all: ['exports'] as const,
  manifest: (teamId: string, studyId: string) =>
    [...exportKeys.all, teamId, studyId, 'manifest'] as const,
};

export const exportsPath = (teamId: string, studyId: string) =>
  `/api/teams/${teamId}/studies/${studyId}/exports`;

/** Which downloads exist for the study and whether the caller's include personal columns. */
export function getExportManifest(teamId: string, studyId: string, signal?: AbortSignal) {
  return api.get<ExportManifest>(`/teams/${teamId}/studies/${studyId}/exports`, signal);
}

export const getExportManifestQueryOptions = (teamId: string, studyId: string) =>
  queryOptions({
    queryKey: exportKeys.manifest(teamId, studyId),
    queryFn: ({ signal }) => getExportManifest(teamId, studyId, signal),
  });

export function useExportManifest(teamId: string, studyId: string) {
  return useQuery(getExportManifestQueryOptions(teamId, studyId));
}
