import type { ResponseRow } from '@shared/schemas/responses';

export const statusLabels: Record<ResponseRow['status'], string> = {
  in_progress: 'In progress',
  completed: 'Completed',
  screened_out: 'Screened out',
  over_quota: 'Over quota',
};

/** Durations as people read them: "8 min 05 s", "42 s". */
export function formatDuration(ms: number | null): string {
  if (ms === null) return '—';
  const s = Math.round(ms / 1000);
  if (s < 60) return `${s} s`;
  const m = Math.floor(s / 60);
  if (m < 60) return `${m} min ${String(s % 60).padStart(2, '0')} s`;
  return `${Math.floor(m / 60)} h ${String(m % 60).padStart(2, '0')} min`;
}
