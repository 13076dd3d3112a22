import { useQuery } from '@tanstack/react-query';
import { apiQueryOptions } from '@/lib/api-query-options';
import type { ExportManifest } from '@shared/schemas/exports';

export const exportKeys = {
  all: ['exports'] as const,
  manifest: (teamId: string, studyId: string) =>
    [...exportKeys.all, teamId, studyId, 'manifest'] as const,
};

export const exportsPath = (teamId: string, studyId: string) =>
  `/api/teams/${teamId}/studies/${studyId}/exports`;

/** Which downloads exist for the study and whether the caller's include personal columns. */
export const getExportManifestQueryOptions = (teamId: string, studyId: string) =>
  apiQueryOptions<ExportManifest>(
    exportKeys.manifest(teamId, studyId),
    `/teams/${teamId}/studies/${studyId}/exports`,
  );

export function useExportManifest(teamId: string, studyId: string) {
  return useQuery(getExportManifestQueryOptions(teamId, studyId));
}
