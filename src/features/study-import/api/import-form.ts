import type { ImportSetupInput } from '@shared/schemas/study-import';

export type ImportFilesInput = { choices: File; background: File | null };

/** The multipart body both import requests send: the files and, when given, the set-up. */
export function buildImportForm(files: ImportFilesInput, setup?: ImportSetupInput): FormData {
  const form = new FormData();
  if (setup) form.append('setup', JSON.stringify(setup));
  form.append('choices', files.choices);
  if (files.background) form.append('background', files.background);
  return form;
}

export const importsPath = (teamId: string) => `/teams/${teamId}/imports`;
