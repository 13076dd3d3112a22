import type { StudyDefinition } from '@shared/schemas/study-definition';
import { Card } from '@/components/ui/feedback';
import { SelectField, TextField } from '@/components/ui/field';
import type { DefinitionSectionProps } from '../utils/definition-section';
import { resizeLabels } from '../utils/definition-drafts';
import { Options } from '@/components/ui/options';

/** How many alternatives a task shows, and whether they carry names (labeled). */
export function AlternativesSettings({
  definition: d,
  errors,
  readOnly,
  onChange,
}: DefinitionSectionProps) {
  const alt = d.alternatives;
  const setAlt = (next: StudyDefinition['alternatives']) => onChange({ ...d, alternatives: next });
  return (
    <Card title="Alternatives in each task">
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField
          label="Designed alternatives per task"
          value={alt.count}
          disabled={readOnly}
          error={errors.get('alternatives.count')}
          hint="Not counting an opt-out or status quo."
          onChange={(e) => setAlt(resizeLabels(d, Number(e.target.value)))}
        >
          <Options items={[2, 3, 4, 5].map((n) => ({ value: n, label: n }))} />
        </SelectField>
        <SelectField
          label="Alternatives are"
          value={alt.labeled ? 'labeled' : 'unlabeled'}
          disabled={readOnly}
          onChange={(e) =>
            setAlt(
              e.target.value === 'labeled'
                ? { ...resizeLabels(d, alt.count), labeled: true }
                : { ...alt, labeled: false },
            )
          }
        >
          <option value="unlabeled">Unlabeled (Option A, B, …)</option>
          <option value="labeled">Labeled (each has its own name)</option>
        </SelectField>
      </div>
      {errors.get('alternatives.labels') && (
        <p role="alert" className="mt-2 text-xs font-medium text-danger">
          {errors.get('alternatives.labels')}
        </p>
      )}
      {alt.labeled && (
        <ul className="mt-4 space-y-3">
          {alt.labels.slice(0, alt.count).map((l, i) => (
            <li key={l.id} className="rounded-md border border-line/70 p-3">
              <TextField
                label={`Name of alternative ${i + 1}`}
                value={l.name}
                disabled={readOnly}
                error={errors.get(`alternatives.labels.${i}.name`)}
                onChange={(e) =>
                  setAlt({
                    ...alt,
                    labels: alt.labels.map((x) =>
                      x.id === l.id ? { ...x, name: e.target.value } : x,
                    ),
                  })
                }
              />
              {d.attributes.length > 0 && (
                <fieldset className="mt-2">
                  <legend className="text-xs text-ink-muted">Attributes that do not apply</legend>
                  <div className="mt-1 flex flex-wrap gap-x-4 gap-y-1">
                    {d.attributes.map((a) => (
                      <label key={a.id} className="flex min-h-8 items-center gap-2 text-sm">
                        <input
                          type="checkbox"
                          className="size-4 accent-primary"
                          disabled={readOnly}
                          checked={l.omittedAttributeIds.includes(a.id)}
                          onChange={(e) =>
                            setAlt({
                              ...alt,
                              labels: alt.labels.map((x) =>
                                x.id !== l.id
                                  ? x
                                  : {
                                      ...x,
                                      omittedAttributeIds: e.target.checked
                                        ? [...x.omittedAttributeIds, a.id]
                                        : x.omittedAttributeIds.filter((id) => id !== a.id),
                                    },
                              ),
                            })
                          }
                        />
                        {a.name || 'Unnamed attribute'}
                      </label>
                    ))}
                  </div>
                </fieldset>
              )}
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}
