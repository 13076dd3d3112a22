import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { StudyPreview } from '@shared/schemas/respondent';
import { previewKeys } from './preview-keys';

export function getStudyPreview(
  teamId: string,
  studyId: string,
  block: number,
  seed: number,
  lang: string | undefined,
  signal?: AbortSignal,
) {
  const language = lang ? `&lang=${encodeURIComponent(lang)}` : '';
  return api.get<StudyPreview>(
    `/teams/${teamId}/studies/${studyId}/preview?block=${block}&seed=${seed}${language}`,
    signal,
  );
}

/** Always read fresh: the preview must show the study as saved right now. */
export const getStudyPreviewQueryOptions = (
  teamId: string,
  studyId: string,
  block: number,
  seed: number,
  lang?: string,
) =>
  queryOptions({
    queryKey: previewKeys.respondent(teamId, studyId, block, seed, lang),
    queryFn: ({ signal }) => getStudyPreview(teamId, studyId, block, seed, lang, signal),
    staleTime: 0,
    retry: false,
  });

export function useStudyPreview(
  teamId: string,
  studyId: string,
  block: number,
  seed: number,
  lang?: string,
) {
  return useQuery(getStudyPreviewQueryOptions(teamId, studyId, block, seed, lang));
}
