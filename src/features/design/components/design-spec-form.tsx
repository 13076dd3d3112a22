import { useState } from 'react';
import type { CodedColumn } from '@shared/engine/coding/coded-columns';
import type { StudyDefinition } from '@shared/schemas/study-definition';
import type { DesignSpec } from '@shared/schemas/design-spec';
import { SelectField, TextField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/feedback';
import {
  buildDesignSpec,
  formValuesFromSpec,
  type DesignFormValues,
} from '../utils/build-design-spec';
import { PriorsTable } from './priors-table';
import { DesignRulesFields } from './design-rules-fields';
import { searchCriteria } from '../utils/criterion-names';
import { designTextField, type DesignTextKey } from '../utils/design-text-field';

type Props = {
  definition: StudyDefinition;
  columns: CodedColumn[];
  disabled: boolean;
  busy: boolean;
  serverErrors: Map<string, string>;
  /** Spec of the current design, used as the starting values. */
  initial?: Partial<DesignSpec>;
  onGenerate: (spec: DesignSpec) => void;
  /** Card title and button text (a candidate beside the current design says so). */
  title?: string;
  submitLabel?: string;
};

const methodHelp: Record<DesignSpec['method'], string> = {
  full_factorial: 'Every allowed profile once; only for small studies.',
  random: 'Levels drawn at random, kept balanced across tasks.',
  d_efficient:
    'Coordinate exchange minimising the chosen criterion under your priors; best of several starts.',
};

export function DesignSpecForm({
  definition,
  columns,
  disabled,
  busy,
  serverErrors,
  initial,
  onGenerate,
  title = 'Generate choice tasks',
  submitLabel = 'Generate design',
}: Props) {
  const [v, setV] = useState<DesignFormValues>(() => formValuesFromSpec(initial));
  const [errors, setErrors] = useState<Map<string, string>>(new Map());
  const shown = errors.size > 0 ? errors : serverErrors;
  const set = (patch: Partial<DesignFormValues>) => setV((old) => ({ ...old, ...patch }));
  const text = (key: DesignTextKey, specPath?: string) =>
    designTextField({ values: v, errors: shown, onChange: set }, key, specPath);
  const submit = () => {
    const built = buildDesignSpec(v, columns);
    if (!built.ok) return setErrors(built.errors);
    setErrors(new Map());
    onGenerate(built.spec);
  };
  const efficient = v.method === 'd_efficient';

  return (
    <Card title={title}>
      <form
        noValidate
        aria-label="Design settings"
        onSubmit={(e) => {
          e.preventDefault();
          submit();
        }}
        className="space-y-4"
      >
        <fieldset disabled={disabled} className="space-y-4">
          <SelectField
            label="Method"
            value={v.method}
            hint={methodHelp[v.method]}
            onChange={(e) => set({ method: e.target.value as DesignSpec['method'] })}
          >
            <option value="d_efficient">D-efficient</option>
            <option value="random">Random (level-balanced)</option>
            <option value="full_factorial">Full factorial</option>
          </SelectField>
          <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
            <TextField
              label="Tasks"
              inputMode="numeric"
              hint={v.method === 'full_factorial' ? 'Leave empty for all' : undefined}
              {...text('tasks')}
            />
            <TextField label="Blocks" inputMode="numeric" {...text('blocks')} />
            {efficient && (
              <TextField label="Random starts" inputMode="numeric" {...text('starts')} />
            )}
            <TextField
              label="Seed"
              inputMode="numeric"
              hint="Same seed, same design"
              {...text('seed')}
            />
          </div>
          {efficient && (
            <div className="space-y-3">
              <div className="grid gap-3 sm:grid-cols-2">
                <SelectField
                  label="Priors"
                  value={v.priorsKind}
                  onChange={(e) =>
                    set({ priorsKind: e.target.value as DesignFormValues['priorsKind'] })
                  }
                >
                  <option value="zero">Zero (no prior knowledge)</option>
                  <option value="fixed">Fixed values</option>
                  <option value="bayesian">Bayesian (normal: mean and SD)</option>
                </SelectField>
                {v.priorsKind === 'bayesian' && (
                  <TextField
                    label="Prior draws"
                    inputMode="numeric"
                    {...text('draws', 'priors.draws')}
                  />
                )}
              </div>
              <div className="grid gap-3 sm:grid-cols-2">
                <SelectField
                  label="Criterion to minimise"
                  value={v.criterion}
                  hint={searchCriteria[v.criterion].explanation}
                  error={shown.get('criterion')}
                  onChange={(e) => set({ criterion: e.target.value as DesignSpec['criterion'] })}
                >
                  {Object.entries(searchCriteria).map(([key, c]) => (
                    <option key={key} value={key}>
                      {c.name}
                    </option>
                  ))}
                </SelectField>
                {v.criterion === 's_estimate' && (
                  <TextField
                    label="Target t-value"
                    inputMode="decimal"
                    hint="1.96: significant at 5 %"
                    {...text('tValue')}
                  />
                )}
              </div>
              {v.priorsKind !== 'zero' && (
                <PriorsTable
                  definition={definition}
                  columns={columns}
                  bayesian={v.priorsKind === 'bayesian'}
                  values={v.priors}
                  errors={shown}
                  onChange={(priors) => set({ priors })}
                />
              )}
              {shown.get('priors.columns') && (
                <p role="alert" className="text-xs font-medium text-danger">
                  {shown.get('priors.columns')}
                </p>
              )}
            </div>
          )}
          <DesignRulesFields definition={definition} values={v} errors={shown} onChange={set} />
        </fieldset>
        {shown.get('method') && (
          <p role="alert" className="text-xs font-medium text-danger">
            {shown.get('method')}
          </p>
        )}
        <Button type="submit" disabled={disabled} busy={busy}>
          {submitLabel}
        </Button>
      </form>
    </Card>
  );
}
