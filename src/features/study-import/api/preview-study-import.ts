import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ImportPreview, ImportSetupInput } from '@shared/schemas/study-import';
import { buildImportForm, importsPath, type ImportFilesInput } from './import-form';

/** Reads the files on the server and lists their problems; nothing is saved. */
export function previewStudyImport(
  teamId: string,
  files: ImportFilesInput,
  setup?: Pick<ImportSetupInput, 'attributes'> & { name?: string },
): Promise<ImportPreview> {
  const body = setup ? { name: setup.name || 'Preview', attributes: setup.attributes } : undefined;
  return api.upload<ImportPreview>(`${importsPath(teamId)}/preview`, buildImportForm(files, body));
}

export function usePreviewStudyImport(teamId: string) {
  return useMutation({
    mutationFn: (input: { files: ImportFilesInput; setup?: ImportSetupInput }) =>
      previewStudyImport(teamId, input.files, input.setup),
  });
}
