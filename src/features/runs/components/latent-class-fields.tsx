/**
 * The run form's latent class settings: one class count or a range (each count is fitted and
 * the table shows LL, parameters, AIC, BIC and CAIC; the lowest BIC is shown), the EM starts
 * and the seed of the random starts.
 */
import type { FieldErrors, UseFormRegister } from 'react-hook-form';
import { TextField } from '@/components/ui/field';
import { LATENT_CLASS_MAX } from '@shared/schemas/estimation-families';
import type { RunFormValues } from '../utils/run-form-values';

export function LatentClassFields({
  register,
  errors,
}: {
  register: UseFormRegister<RunFormValues>;
  errors: FieldErrors<RunFormValues>;
}) {
  const number = { type: 'number', inputMode: 'numeric' } as const;
  return (
    <fieldset className="grid gap-4 sm:grid-cols-4">
      <legend className="mb-2 text-sm font-medium text-ink">Classes</legend>
      <TextField
        label="Fewest classes"
        error={errors.classesMin?.message}
        {...number}
        {...register('classesMin', { valueAsNumber: true })}
      />
      <TextField
        label="Most classes"
        hint={`Up to ${LATENT_CLASS_MAX}`}
        error={errors.classesMax?.message}
        {...number}
        {...register('classesMax', { valueAsNumber: true })}
      />
      <TextField
        label="EM starts per class count"
        error={errors.starts?.message}
        {...number}
        {...register('starts', { valueAsNumber: true })}
      />
      <TextField
        label="Seed"
        error={errors.seed?.message}
        {...number}
        {...register('seed', { valueAsNumber: true })}
      />
      <p className="text-xs text-ink-muted sm:col-span-4">
        Each class count in the range is fitted from every start; the run reports the one with the
        lowest BIC and a table of LL, parameters, AIC, BIC and CAIC so you can choose another. More
        classes than the data can identify end the run with the reason.
      </p>
    </fieldset>
  );
}
