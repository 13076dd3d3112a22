import { useId, type ReactNode } from 'react';

/** A labelled checkbox for a setting, with an optional line of help under it. */
export function CheckboxField({
  label,
  checked,
  onChange,
  hint,
  disabled,
}: {
  label: string;
  checked: boolean;
  onChange: (checked: boolean) => void;
  hint?: ReactNode;
  disabled?: boolean;
}) {
  const id = useId();
  return (
    <div>
      <label className="flex min-h-8 items-center gap-2 text-sm">
        <input
          type="checkbox"
          className="size-4 accent-primary"
          checked={checked}
          disabled={disabled}
          aria-describedby={hint ? `${id}-hint` : undefined}
          onChange={(e) => onChange(e.target.checked)}
        />
        {label}
      </label>
      {hint && (
        <p id={`${id}-hint`} className="ml-6 text-xs text-ink-muted">
          {hint}
        </p>
      )}
    </div>
  );
}

/** The unlabelled tick beside a list row that puts the row into a side-by-side comparison. */
export function CompareCheckbox({
  name,
  checked,
  onToggle,
}: {
  /** The row's name, read out as "Compare <name>". */
  name: string;
  checked: boolean;
  onToggle: () => void;
}) {
  return (
    <input
      type="checkbox"
      className="size-4 accent-primary"
      aria-label={`Compare ${name}`}
      checked={checked}
      onChange={onToggle}
    />
  );
}
