/**
 * The run form's estimation settings: preference or WTP space, which covariance the intervals
 * use, convergence tolerances, the iteration limit and the simulation-noise check.
 */
import { SelectField, TextField } from '@/components/ui/field';
import type { RunFormValues } from '../utils/run-form-values';
import { formField, formNumberField, type BoundForm } from '@/components/ui/form-field';

export function EstimationSettingsFields({
  form,
  mixed,
}: {
  form: BoundForm<RunFormValues>;
  mixed: boolean;
}) {
  return (
    <details className="rounded-md border border-line bg-white px-3 py-2">
      <summary className="cursor-pointer text-sm font-medium text-ink">Estimation settings</summary>
      <div className="mt-3 grid gap-4 sm:grid-cols-3">
        <SelectField
          label="Space"
          hint="WTP space needs a cost column (fixed or lognormal)"
          {...formField(form, 'space')}
        >
          <option value="preference">Preference space</option>
          <option value="wtp">WTP space (Train &amp; Weeks)</option>
        </SelectField>
        <SelectField label="Covariance for intervals" {...formField(form, 'covariance')}>
          <option value="robust">Robust, clustered by respondent</option>
          <option value="classical">Classical (inverse Hessian)</option>
          <option value="bhhh">BHHH (outer product, no Hessian)</option>
        </SelectField>
        <TextField
          label="Iteration limit per start"
          type="number"
          inputMode="numeric"
          hint={mixed ? 'Empty: 300' : 'Empty: 100'}
          {...formField(form, 'maxIterations')}
        />
        <TextField
          label="Newton decrement tolerance"
          hint="g′A⁻¹g at convergence"
          {...formNumberField(form, 'tolerance', 'decimal')}
        />
        <TextField
          label="Relative gradient tolerance"
          {...formNumberField(form, 'gradientTolerance', 'decimal')}
        />
        {mixed && (
          <label className="flex items-center gap-2 self-end pb-2 text-sm text-ink">
            <input
              type="checkbox"
              className="size-4 accent-primary"
              {...form.register('simulationCheck')}
            />
            Check simulation noise (3 more draw seeds)
          </label>
        )}
      </div>
    </details>
  );
}
