import { qualityFlagKeys, qualityFlagLabels, type QualityFlags } from '@shared/schemas/responses';

/** The flags a respondent carries; a dash when none. */
export function FlagBadges({ flags }: { flags: QualityFlags }) {
  const on = qualityFlagKeys.filter((k) => flags[k] === true);
  if (on.length === 0) return <span className="text-ink-muted">—</span>;
  return (
    <ul className="flex flex-wrap gap-1" aria-label="Quality flags">
      {on.map((k) => (
        <li
          key={k}
          title={qualityFlagLabels[k].help}
          className="rounded-full border border-oi-vermillion/40 bg-accent-soft px-2 py-0.5 text-xs font-medium text-ink"
        >
          {qualityFlagLabels[k].label}
        </li>
      ))}
    </ul>
  );
}
