/**
 * The form that starts a run: model (MNL, mixed logit, HB or latent class, with help on when
 * to prefer which), a distribution (or "leave out") per coded column, the model's own settings
 * and which respondents. Validated with the shared create-run schema; the server's field errors
 * come back onto the same fields.
 */
import { useForm, useWatch } from 'react-hook-form';
import type { ModelColumn, Run, RunOptions } from '@shared/schemas/run';
import { drawsTypeLabels, drawsTypeSchema } from '@shared/schemas/estimation-spec';
import { MODEL_LABELS } from '@shared/schemas/estimation-families';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { Alert } from '@/components/ui/feedback';
import { ApiError } from '@/lib/api-client';
import { useCreateRun } from '../api/create-run';
import { EstimationSettingsFields } from './estimation-settings-fields';
import { HbFields } from './hb-fields';
import { LatentClassFields } from './latent-class-fields';
import { ModelHelp } from './model-help';
import {
  createRunFormResolver,
  getColumnDefault,
  getDefaultRunFormValues,
  getDefaultStarts,
  toCreateRunInput,
  toFormField,
  type ColumnChoice,
  type RunFormModel,
  type RunFormValues,
} from '../utils/run-form-values';
import { CorrelatedTastesField } from './correlated-tastes-field';
import { formField, type BoundForm } from '@/components/ui/form-field';
import { FormTextFields, type TextFieldSpec } from '@/components/ui/form-text-fields';
import { Options } from '@/components/ui/options';

const distributionLabels: Record<ColumnChoice, string> = {
  omit: 'Leave out',
  fixed: 'Fixed',
  normal: 'Normal',
  lognormal: 'Lognormal (positive)',
  neg_lognormal: 'Lognormal, negative (cost)',
  triangular: 'Triangular',
  uniform: 'Uniform',
};

const coefficientHelp: Record<RunFormModel, string> = {
  mnl: 'An MNL has fixed coefficients only.',
  mixed: 'Random tastes vary across respondents; a cost is usually negative lognormal.',
  hb: 'Random tastes vary across respondents (normal, or lognormal to fix a sign, such as a negative cost); fixed ones are shared.',
  latent_class: 'Coefficients are fixed within each class and differ between classes.',
};

/** The mixed logit's simulation settings. */
const drawFields: TextFieldSpec<RunFormValues>[] = [
  { name: 'drawsCount', label: 'Draws per respondent', number: 'whole' },
  {
    name: 'profileDraws',
    label: 'Draws for taste profiles',
    hint: 'More than for estimation',
    number: 'whole',
  },
  { name: 'seed', label: 'Seed', number: 'whole' },
  {
    name: 'starts',
    label: 'Starting points',
    hint: 'The MNL start plus perturbed ones',
    number: 'whole',
  },
];

function ColumnRow({
  column,
  index,
  model,
  form,
}: {
  column: ModelColumn;
  index: number;
  model: RunFormModel;
  form: BoundForm<RunFormValues>;
}) {
  const choices: ColumnChoice[] =
    model === 'mnl' || model === 'latent_class'
      ? ['fixed', 'omit']
      : model === 'hb'
        ? ['fixed', 'normal', 'lognormal', 'neg_lognormal', 'omit']
        : ['fixed', 'normal', 'lognormal', 'neg_lognormal', 'triangular', 'uniform', 'omit'];
  return (
    <div className="grid gap-1 border-b border-line py-2 last:border-b-0 sm:grid-cols-[1fr_15rem] sm:items-center sm:gap-4">
      <div className="min-w-0">
        <p className="text-sm text-ink">
          {column.label}
          {column.isCost && (
            <Badge tone="accent" className="ml-2">
              cost
            </Badge>
          )}
        </p>
        <p className="truncate font-mono text-xs text-ink-muted">{column.code}</p>
      </div>
      <SelectField
        label={<span className="sr-only">Distribution of {column.label}</span>}
        {...formField(form, `columns.${index}.distribution`)}
      >
        <Options items={choices.map((c) => ({ value: c, label: distributionLabels[c] }))} />
      </SelectField>
    </div>
  );
}

export function RunForm({
  teamId,
  studyId,
  options,
  onStarted,
}: {
  teamId: string;
  studyId: string;
  options: RunOptions;
  onStarted?: (run: Run) => void;
}) {
  const create = useCreateRun(teamId, studyId);
  const form = useForm<RunFormValues>({
    defaultValues: getDefaultRunFormValues(options),
    resolver: createRunFormResolver(options.columns),
  });
  const {
    handleSubmit,
    setValue,
    setError,
    control,
    formState: { errors },
  } = form;
  const model = useWatch({ control, name: 'model' });
  const mixed = model === 'mixed';
  const classical = model === 'mnl' || mixed;

  const switchModel = (next: RunFormModel) => {
    options.columns.forEach((c, i) =>
      setValue(`columns.${i}.distribution`, getColumnDefault(c, next)),
    );
    setValue('starts', getDefaultStarts(next));
  };

  const onSubmit = handleSubmit(async (values) => {
    try {
      const run = await create.mutateAsync(toCreateRunInput(values, options.columns));
      onStarted?.(run);
    } catch (err) {
      if (err instanceof ApiError && err.fields.length > 0) {
        for (const f of err.fields)
          setError(toFormField(f.path, values) as 'root', { type: 'server', message: f.message });
      } else {
        setError('root', {
          type: 'server',
          message: err instanceof Error ? err.message : 'The run could not be started.',
        });
      }
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-5">
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField
          label="Model"
          {...formField(form, 'model', { onChange: (e) => switchModel(e.target.value) })}
        >
          <Options
            items={(Object.keys(MODEL_LABELS) as RunFormModel[]).map((m) => ({
              value: m,
              label: MODEL_LABELS[m],
            }))}
          />
        </SelectField>
        <TextField label="Name" placeholder={MODEL_LABELS[model]} {...formField(form, 'name')} />
      </div>

      <ModelHelp model={model} />

      <fieldset>
        <legend className="mb-1 text-sm font-medium text-ink">Coefficients</legend>
        <p className="mb-2 text-xs text-ink-muted">
          One coefficient per coded column. {coefficientHelp[model]}
        </p>
        <div className="rounded-md border border-line bg-white px-3">
          {options.columns.map((column, i) => (
            <ColumnRow key={column.key} column={column} index={i} model={model} form={form} />
          ))}
        </div>
      </fieldset>

      {mixed && (
        <fieldset className="grid gap-4 sm:grid-cols-3">
          <legend className="mb-2 text-sm font-medium text-ink">Simulation</legend>
          <SelectField label="Draws" {...formField(form, 'drawsType')}>
            <Options
              items={drawsTypeSchema.options.map((t) => ({
                value: t,
                label: drawsTypeLabels[t].charAt(0).toUpperCase() + drawsTypeLabels[t].slice(1),
              }))}
            />
          </SelectField>
          <FormTextFields form={form} fields={drawFields} />
          <CorrelatedTastesField form={form} label="Correlated normal tastes" />
        </fieldset>
      )}

      {model === 'hb' && <HbFields form={form} />}
      {model === 'latent_class' && (
        <LatentClassFields form={form} questions={options.membershipQuestions} />
      )}

      {classical && <EstimationSettingsFields form={form} mixed={mixed} />}

      <SelectField
        label="Respondents"
        hint={`${options.includedRespondents} included respondents have completed the questionnaire.`}
        {...formField(form, 'filterId')}
      >
        <option value="">All included respondents</option>
        {options.filters.map((f) => (
          <option key={f.id} value={f.id}>
            Saved filter: {f.name}
          </option>
        ))}
      </SelectField>

      {errors.root?.message && <Alert tone="danger">{errors.root.message}</Alert>}
      <div className="flex justify-end">
        <Button type="submit" busy={create.isPending}>
          Start run
        </Button>
      </div>
    </form>
  );
}
