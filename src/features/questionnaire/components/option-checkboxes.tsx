import type { ChoiceOption } from '@shared/schemas/questionnaire';
import { CheckboxList } from '@/components/ui/checkbox-field';

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
  return (
    <CheckboxList items={options} selected={selected} onChange={onChange} boxClassName="size-4" />
  );
}
