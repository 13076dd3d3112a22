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

/**
 * One labelled checkbox per item, for picking several of a list: `selected` holds the ids of
 * the ticked items, and each tick or untick reports the whole new list.
 */
export function CheckboxList({
  items,
  selected,
  onChange,
  boxClassName,
}: {
  items: readonly { id: string; label: ReactNode }[];
  selected: string[];
  onChange: (ids: string[]) => void;
  boxClassName: string;
}) {
  return items.map((item) => (
    <label key={item.id} className="flex items-center gap-2 text-sm text-ink">
      <input
        type="checkbox"
        className={boxClassName}
        checked={selected.includes(item.id)}
        onChange={(e) =>
          onChange(
            e.target.checked ? [...selected, item.id] : selected.filter((x) => x !== item.id),
          )
        }
      />
      {item.label}
    </label>
  ));
}
