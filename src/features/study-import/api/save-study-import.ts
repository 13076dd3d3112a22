import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ImportResult, ImportSetupInput } from '@shared/schemas/study-import';
import { studyKeys } from '@/features/studies/api/study-keys';
import { buildImportForm, importsPath, type ImportFilesInput } from './import-form';

/** Creates the study from the files with the confirmed set-up (refused while any problem is left). */
export function saveStudyImport(
  teamId: string,
  files: ImportFilesInput,
  setup: ImportSetupInput,
): Promise<ImportResult> {
  return api.upload<ImportResult>(importsPath(teamId), buildImportForm(files, setup));
}

export function useSaveStudyImport(teamId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { files: ImportFilesInput; setup: ImportSetupInput }) =>
      saveStudyImport(teamId, input.files, input.setup),
    onSuccess: () => void qc.invalidateQueries({ queryKey: studyKeys.lists(teamId) }),
  });
}
