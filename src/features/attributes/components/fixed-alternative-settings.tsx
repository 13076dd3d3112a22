import type { StudyDefinition } from '@shared/schemas/study-definition';
import { Card } from '@/components/ui/feedback';
import { SelectField, TextField } from '@/components/ui/field';
import type { DefinitionSectionProps } from '../utils/definition-section';
import { getLevelLabel } from '@shared/study/level-labels';

const defaultLabels = { opt_out: 'None of these', status_quo: 'Keep things as they are' };

/** An optional extra alternative in every task: "none of these", or the status quo at fixed levels. */
export function FixedAlternativeSettings({
  definition: d,
  errors,
  readOnly,
  onChange,
}: DefinitionSectionProps) {
  const fx = d.fixedAlternative;
  const set = (next: StudyDefinition['fixedAlternative']) =>
    onChange({ ...d, fixedAlternative: next });
  return (
    <Card title="Opt-out or status quo">
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField
          label="Extra alternative in every task"
          value={fx?.kind ?? 'none'}
          disabled={readOnly}
          onChange={(e) => {
            const kind = e.target.value;
            if (kind === 'none') return set(null);
            const k = kind as 'opt_out' | 'status_quo';
            set({
              kind: k,
              label: fx?.label && fx.kind === k ? fx.label : defaultLabels[k],
              levels:
                k === 'status_quo'
                  ? Object.fromEntries(d.attributes.map((a) => [a.id, a.levels[0]?.id ?? '']))
                  : {},
            });
          }}
        >
          <option value="none">None</option>
          <option value="opt_out">Opt-out (“none of these”)</option>
          <option value="status_quo">Status quo at fixed levels</option>
        </SelectField>
        {fx && (
          <TextField
            label="Shown as"
            value={fx.label}
            disabled={readOnly}
            error={errors.get('fixedAlternative.label')}
            onChange={(e) => set({ ...fx, label: e.target.value })}
          />
        )}
      </div>
      {fx?.kind === 'status_quo' && d.attributes.length > 0 && (
        <div className="mt-4 grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
          {d.attributes.map((a) => (
            <SelectField
              key={a.id}
              label={a.name || 'Unnamed attribute'}
              value={fx.levels[a.id] ?? ''}
              disabled={readOnly}
              error={errors.get(`fixedAlternative.levels.${a.id}`)}
              onChange={(e) => set({ ...fx, levels: { ...fx.levels, [a.id]: e.target.value } })}
            >
              <option value="">Choose…</option>
              {a.levels.map((l, i) => (
                <option key={l.id} value={l.id}>
                  {getLevelLabel(a, l) || `Level ${i + 1}`}
                </option>
              ))}
            </SelectField>
          ))}
        </div>
      )}
    </Card>
  );
}
