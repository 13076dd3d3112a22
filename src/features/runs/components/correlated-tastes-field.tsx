import type { BoundForm } from '@/components/ui/form-field';
import type { RunFormValues } from '../utils/run-form-values';

/**
 * Whether the random tastes are estimated with their correlations (a full covariance) or as
 * independent; the mixed logit and HB settings both ask it, in a three-column settings grid.
 */
export function CorrelatedTastesField({
  form,
  label,
}: {
  form: BoundForm<RunFormValues>;
  label: string;
}) {
  const message = form.formState.errors.correlated?.message;
  return (
    <>
      <label className="flex items-center gap-2 self-end pb-2 text-sm text-ink">
        <input type="checkbox" className="size-4 accent-primary" {...form.register('correlated')} />
        {label}
      </label>
      {message && (
        <p role="alert" className="text-xs font-medium text-danger sm:col-span-3">
          {message}
        </p>
      )}
    </>
  );
}
