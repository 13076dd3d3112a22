/** Durations as people read them: "8 min 05 s", "42 s", "1 h 02 min". */
export function formatDuration(ms: number | null): string {
  if (ms === null) return '—';
  const s = Math.round(ms / 1000);
  if (s < 60) return `${s} s`;
  const m = Math.floor(s / 60);
  if (m < 60) return `${m} min ${String(s % 60).padStart(2, '0')} s`;
  return `${Math.floor(m / 60)} h ${String(m % 60).padStart(2, '0')} min`;
}

export const formatPercent = (x: number | null, digits = 0) =>
  x === null ? '—' : `${(x * 100).toFixed(digits)} %`;

export const formatCount = (n: number) => n.toLocaleString('en-GB');
