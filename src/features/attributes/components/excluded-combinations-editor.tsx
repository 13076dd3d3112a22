/**
 * Excluded combinations: the rules of what the design may never show, listed in words, with a
 * form for each kind (excluded-combination-form.tsx).
 */
import { describeExcludedCombination } from '@shared/study/excluded-combinations';
import { Card } from '@/components/ui/feedback';
import { Button } from '@/components/ui/button';
import type { DefinitionSectionProps } from '../utils/definition-section';
import { ExcludedCombinationForm } from './excluded-combination-form';

export function ExcludedCombinationsEditor({
  definition: d,
  errors,
  readOnly,
  onChange,
}: DefinitionSectionProps) {
  const rules = d.excludedCombinations;
  return (
    <Card title="Excluded combinations">
      <p className="mb-3 text-sm text-ink-soft">
        What the choice tasks must never show: two levels together, a level that calls for others, a
        comparison with the status quo, or a comparison between two alternatives of a task.
      </p>
      {rules.length > 0 && (
        <ul className="mb-4 space-y-2" aria-label="Excluded combinations">
          {rules.map((rule, i) => (
            <li
              key={rule.id}
              className="flex flex-wrap items-center gap-2 rounded-md border border-line/70 px-3 py-2 text-sm"
            >
              <span className="flex-1">{describeExcludedCombination(d, rule)}</span>
              {errors.get(`excludedCombinations.${i}`) && (
                <span role="alert" className="text-xs text-danger">
                  {errors.get(`excludedCombinations.${i}`)}
                </span>
              )}
              {!readOnly && (
                <Button
                  size="sm"
                  variant="ghost"
                  aria-label={`Remove: ${describeExcludedCombination(d, rule)}`}
                  onClick={() =>
                    onChange({ ...d, excludedCombinations: rules.filter((x) => x.id !== rule.id) })
                  }
                >
                  Remove
                </Button>
              )}
            </li>
          ))}
        </ul>
      )}
      {!readOnly && d.attributes.length > 0 && (
        <ExcludedCombinationForm
          definition={d}
          onAdd={(rule) => onChange({ ...d, excludedCombinations: [...rules, rule] })}
        />
      )}
    </Card>
  );
}
