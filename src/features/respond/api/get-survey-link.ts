import { api } from '@/lib/api-client';
import type { SurveyLinkInfo } from '@shared/schemas/respondent';

/** Whether the survey behind a link is open (the link's query passes the panel id along). */
export function getSurveyLink(publicId: string, search: string): Promise<SurveyLinkInfo> {
  return api.get<SurveyLinkInfo>(`/r/${encodeURIComponent(publicId)}${search}`);
}
