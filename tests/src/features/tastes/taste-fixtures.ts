import type { TasteHeader } from '@shared/schemas/tastes';

/** The finished mixed logit run the taste tests show profiles of (invented). */
export const mixedTastesRun: TasteHeader['run'] = {
  id: 'run1',
  name: 'Mixed',
  model: 'mixed',
  finishedAt: null,
  profiles: 30,
  profileDraws: 500,
  erasedRespondents: 0,
  wtpUnavailable: null,
};
