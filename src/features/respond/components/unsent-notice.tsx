import type { UnsentAnswer } from '../utils/respondent-storage';

/**
 * Answers the survey refused for good (for example given after it closed). They are never
 * dropped silently: the respondent sees how many were not saved and the survey's reason.
 */
export function UnsentNotice({ unsent }: { unsent: UnsentAnswer[] }) {
  if (unsent.length === 0) return null;
  const reasons = [...new Set(unsent.map((u) => u.reason))];
  const n = unsent.length;
  return (
    <div
      role="status"
      className="mx-auto mb-4 max-w-2xl rounded-md border border-accent/60 bg-accent-soft px-4 py-3 text-sm text-ink"
    >
      <p className="font-medium">
        {n === 1 ? '1 answer' : `${n} answers`} from this device could not be saved.
      </p>
      <ul className="mt-1 list-disc space-y-1 ps-5 text-ink-soft">
        {reasons.map((r) => (
          <li key={r}>{r}</li>
        ))}
      </ul>
    </div>
  );
}
