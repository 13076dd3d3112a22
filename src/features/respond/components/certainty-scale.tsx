/**
 * The certainty question under a choice task: one row of numbered radio buttons, 1 at the
 * "not sure" end, with the end labels read out with the question. Numbered buttons of equal
 * size fit ten points across a 320 px phone.
 */
import { useId } from 'react';
import type { CertaintyScale } from '@shared/schemas/questionnaire';

export function CertaintyScaleField({
  scale,
  value,
  onChange,
}: {
  scale: CertaintyScale;
  value: number | null;
  onChange: (value: number) => void;
}) {
  const id = useId();
  const points = Array.from({ length: scale.points }, (_, i) => i + 1);
  return (
    <fieldset className="mt-6 min-w-0 max-w-xl" aria-describedby={`${id}-ends`}>
      <legend className="mb-2 text-base font-medium text-ink">{scale.question}</legend>
      <p id={`${id}-ends`} className="sr-only">
        1 means {scale.lowLabel}, {scale.points} means {scale.highLabel}.
      </p>
      <div className="flex gap-1">
        {points.map((n) => (
          <label key={n} className="min-w-0 flex-1">
            <input
              type="radio"
              name={id}
              value={n}
              checked={value === n}
              onChange={() => onChange(n)}
              className="peer sr-only"
            />
            <span className="flex h-11 items-center justify-center rounded-md border border-line bg-white text-sm font-medium text-ink peer-checked:border-primary peer-checked:bg-primary peer-checked:text-white peer-focus-visible:ring-2 peer-focus-visible:ring-primary peer-focus-visible:ring-offset-2">
              {n}
            </span>
          </label>
        ))}
      </div>
      <div aria-hidden className="mt-1 flex justify-between gap-4 text-xs text-ink-muted">
        <span>{scale.lowLabel}</span>
        <span className="text-end">{scale.highLabel}</span>
      </div>
    </fieldset>
  );
}
