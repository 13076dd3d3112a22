import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type {
  EraseRespondentInput,
  ErasureLookup,
  ErasurePreview,
  ErasureResult,
} from '@shared/schemas/erasure';
import { fieldworkKeys } from '@/features/fieldwork/api/fieldwork-keys';
import { inviteeKeys } from '@/features/invitees/api/invitee-keys';
import { runKeys } from '@/features/runs/api/run-keys';
import { tasteKeys } from '@/features/tastes/api/taste-keys';
import { auditKeys } from '@/features/audit/api/audit-keys';
import { responseKeys } from './response-keys';

const erasurePath = (teamId: string, studyId: string) =>
  `/teams/${teamId}/studies/${studyId}/erasure`;

/** What erasing the respondent found by `lookup` would remove (changes nothing). */
export function previewErasure(teamId: string, studyId: string, lookup: ErasureLookup) {
  return api.post<ErasurePreview>(`${erasurePath(teamId, studyId)}/preview`, lookup);
}

export function eraseRespondent(teamId: string, studyId: string, input: EraseRespondentInput) {
  return api.post<ErasureResult>(erasurePath(teamId, studyId), input);
}

export function usePreviewErasure(teamId: string, studyId: string) {
  return useMutation({
    mutationFn: (lookup: ErasureLookup) => previewErasure(teamId, studyId, lookup),
  });
}

/** Erasure touches respondents, invitees, runs, taste profiles and the audit trail. */
export function useEraseRespondent(teamId: string, studyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: EraseRespondentInput) => eraseRespondent(teamId, studyId, input),
    onSuccess: () =>
      Promise.all(
        [
          responseKeys.all,
          fieldworkKeys.all,
          inviteeKeys.all,
          runKeys.all,
          tasteKeys.all,
          auditKeys.all,
        ].map((queryKey) => qc.invalidateQueries({ queryKey })),
      ),
  });
}
