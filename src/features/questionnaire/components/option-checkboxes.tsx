import type { ChoiceOption } from '@shared/schemas/questionnaire';

/** One checkbox per answer option; `selected` lists the ticked option ids. */
export function OptionCheckboxes({
  options,
  selected,
  onChange,
}: {
  options: ChoiceOption[];
  selected: string[];
  onChange: (ids: string[]) => void;
}) {
  return options.map((o) => (
    <label key={o.id} className="flex items-center gap-2 text-sm text-ink">
      <input
        type="checkbox"
        className="size-4"
        checked={selected.includes(o.id)}
        onChange={(e) =>
          onChange(e.target.checked ? [...selected, o.id] : selected.filter((x) => x !== o.id))
        }
      />
      {o.label}
    </label>
  ));
}
