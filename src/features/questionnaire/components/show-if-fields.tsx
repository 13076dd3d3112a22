/**
 * Skip logic of a page: show it only when the answer to an earlier question matches. The rule
 * is checked with the rest of the questionnaire (shared/survey/skip-logic.ts) before saving.
 */
import { CheckboxField } from '@/components/ui/checkbox-field';
import { SelectField } from '@/components/ui/field';
import { NumberRangeFields } from '@/components/ui/number-range-fields';
import type { Question, ShowIf } from '@shared/schemas/questionnaire';
import { OptionCheckboxes } from './option-checkboxes';
import { Options } from '@/components/ui/options';

const emptyRule = (q: Question): ShowIf => ({
  questionKey: q.key,
  optionIds: [],
  min: null,
  max: null,
});

export function ShowIfFields({
  showIf,
  earlier,
  onChange,
}: {
  showIf: ShowIf | null | undefined;
  /** Choice and number questions on the pages before this one. */
  earlier: Question[];
  onChange: (showIf: ShowIf | null) => void;
}) {
  const source = showIf ? earlier.find((q) => q.key === showIf.questionKey) : undefined;
  return (
    <div className="space-y-3">
      <CheckboxField
        label="Show this page only when an earlier answer matches"
        checked={!!showIf}
        disabled={!showIf && earlier.length === 0}
        onChange={(on) => onChange(on && earlier[0] ? emptyRule(earlier[0]) : null)}
        hint={
          earlier.length === 0
            ? 'Add a choice or number question before this page to make it depend on the answer.'
            : 'Respondents whose answer does not match go past this page; their answer is stored as skipped. Neither that answer nor this page can be changed through Back afterwards.'
        }
      />
      {showIf && (
        <div className="space-y-3 border-l-2 border-line pl-4">
          <SelectField
            label="When the answer to"
            value={showIf.questionKey}
            onChange={(e) => {
              const q = earlier.find((x) => x.key === e.target.value);
              if (q) onChange(emptyRule(q));
            }}
          >
            {!source && <option value={showIf.questionKey}>{showIf.questionKey} (missing)</option>}
            <Options items={earlier.map((q) => ({ value: q.key, label: q.text }))} />
          </SelectField>
          {source && (source.type === 'single' || source.type === 'multiple') && (
            <div className="space-y-1" role="group" aria-label="is one of">
              <p className="text-sm font-medium text-ink">is one of</p>
              <OptionCheckboxes
                options={source.options}
                selected={showIf.optionIds}
                onChange={(optionIds) => onChange({ ...showIf, optionIds })}
              />
            </div>
          )}
          {source?.type === 'number' && (
            <NumberRangeFields
              labels={{
                low: 'is at least (empty: no limit)',
                high: 'and at most (empty: no limit)',
              }}
              limits={{ low: showIf.min, high: showIf.max }}
              onCommit={({ low, high }) => onChange({ ...showIf, min: low, max: high })}
            />
          )}
        </div>
      )}
    </div>
  );
}
