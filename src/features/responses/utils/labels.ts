import type { ResponseRow } from '@shared/schemas/responses';

export const statusLabels: Record<ResponseRow['status'], string> = {
  in_progress: 'In progress',
  completed: 'Completed',
  screened_out: 'Screened out',
  over_quota: 'Over quota',
};
