/**
 * An optional lower and an optional upper limit side by side, each a NumberTextField committed
 * on leaving it; an empty field is no limit (null). Used wherever a rule takes a number range
 * (show-if rules, a screening question's accepted range, a quota group's answers).
 */
import { NumberTextField } from './number-text-field';

export type NumberLimits = { low: number | null; high: number | null };

export function NumberRangeFields({
  labels,
  limits,
  onCommit,
  integer,
}: {
  labels: { low: string; high: string };
  limits: NumberLimits;
  onCommit: (limits: NumberLimits) => void;
  integer?: boolean;
}) {
  return (
    // Stacked on a phone, where the labels would wrap; side by side from the small breakpoint.
    <div className="grid gap-3 sm:grid-cols-2">
      <NumberTextField
        label={labels.low}
        integer={integer}
        value={limits.low}
        onCommit={(low) => onCommit({ ...limits, low })}
      />
      <NumberTextField
        label={labels.high}
        integer={integer}
        value={limits.high}
        onCommit={(high) => onCommit({ ...limits, high })}
      />
    </div>
  );
}
