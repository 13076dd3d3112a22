/**
 * The run form's estimation settings: preference or WTP space, which covariance the intervals
 * use, convergence tolerances, the iteration limit and the simulation-noise check.
 */
import type { FieldErrors, UseFormRegister } from 'react-hook-form';
import { SelectField, TextField } from '@/components/ui/field';
import type { RunFormValues } from '../utils/run-form-values';

export function EstimationSettingsFields({
  register,
  errors,
  mixed,
}: {
  register: UseFormRegister<RunFormValues>;
  errors: FieldErrors<RunFormValues>;
  mixed: boolean;
}) {
  return (
    <details className="rounded-md border border-line bg-white px-3 py-2">
      <summary className="cursor-pointer text-sm font-medium text-ink">Estimation settings</summary>
      <div className="mt-3 grid gap-4 sm:grid-cols-3">
        <SelectField
          label="Space"
          hint="WTP space needs a cost column (fixed or lognormal)"
          error={errors.space?.message}
          {...register('space')}
        >
          <option value="preference">Preference space</option>
          <option value="wtp">WTP space (Train &amp; Weeks)</option>
        </SelectField>
        <SelectField
          label="Covariance for intervals"
          error={errors.covariance?.message}
          {...register('covariance')}
        >
          <option value="robust">Robust, clustered by respondent</option>
          <option value="classical">Classical (inverse Hessian)</option>
          <option value="bhhh">BHHH (outer product, no Hessian)</option>
        </SelectField>
        <TextField
          label="Iteration limit per start"
          type="number"
          inputMode="numeric"
          hint={mixed ? 'Empty: 300' : 'Empty: 100'}
          error={errors.maxIterations?.message}
          {...register('maxIterations')}
        />
        <TextField
          label="Newton decrement tolerance"
          type="number"
          step="any"
          hint="g′A⁻¹g at convergence"
          error={errors.tolerance?.message}
          {...register('tolerance', { valueAsNumber: true })}
        />
        <TextField
          label="Relative gradient tolerance"
          type="number"
          step="any"
          error={errors.gradientTolerance?.message}
          {...register('gradientTolerance', { valueAsNumber: true })}
        />
        {mixed && (
          <label className="flex items-center gap-2 self-end pb-2 text-sm text-ink">
            <input
              type="checkbox"
              className="size-4 accent-primary"
              {...register('simulationCheck')}
            />
            Check simulation noise (3 more draw seeds)
          </label>
        )}
      </div>
    </details>
  );
}
