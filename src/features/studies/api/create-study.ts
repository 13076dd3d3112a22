import { api } from '@/lib/api-client';
import type { CreateStudyInput, Study } from '@shared/schemas/study';
import { useStudyMutation } from './use-study-mutation';

export function createStudy(teamId: string, input: CreateStudyInput): Promise<Study> {
  return api.post<Study>(`/teams/${teamId}/studies`, input);
}

export function useCreateStudy(teamId: string) {
  return useStudyMutation({ teamId }, (input: CreateStudyInput) => createStudy(teamId, input));
}
