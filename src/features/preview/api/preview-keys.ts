import { studyScopedKeys } from '@/lib/study-scoped-keys';

/** Query keys of the preview feature. */
export const previewKeys = {
  ...studyScopedKeys('preview'),
  respondent: (teamId: string, studyId: string, block: number, seed: number, lang = '') =>
    [...previewKeys.study(teamId, studyId), block, seed, lang] as const,
};
