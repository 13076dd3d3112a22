import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { saveFile } from '@/lib/save-file';
import type { ShareExportInput } from '@shared/schemas/shares';
import { sharesPath } from './share-keys';

/** The scenario on screen (and its demand curve) as CSV or XLSX, recomputed by the server. */
export function exportShares(teamId: string, studyId: string, input: ShareExportInput) {
  return api.postForFile(`${sharesPath(teamId, studyId)}/export`, input);
}

export function useExportShares(teamId: string, studyId: string) {
  return useMutation({
    mutationFn: (input: ShareExportInput) => exportShares(teamId, studyId, input),
    onSuccess: saveFile,
  });
}
