/**
 * The submit handler of a form that saves through the API: the resolver checks the values
 * first, then `action` runs with them, and field errors in the server's answer are put on their
 * fields, so the person sees them where they typed. Other errors stay with the mutation, whose
 * `error` the form shows.
 */
import type { FieldValues, UseFormReturn, UseFormSetError } from 'react-hook-form';
import { applyFieldErrors } from './api-client';

export function submitForm<T extends FieldValues>(
  form: Pick<UseFormReturn<T>, 'handleSubmit' | 'setError'>,
  action: (values: T) => Promise<unknown>,
) {
  return form.handleSubmit(async (values) => {
    try {
      await action(values);
    } catch (err) {
      applyFieldErrors(err, form.setError);
    }
  });
}

/**
 * Puts a server error where the person will look: on the fields it names, or (when it names
 * none) as one message under `root.server`, which the form shows above its submit button.
 */
export function applyServerError<T extends FieldValues>(
  err: unknown,
  setError: UseFormSetError<T>,
) {
  if (applyFieldErrors(err, setError as never)) return;
  const message = err instanceof Error ? err.message : 'Something went wrong.';
  setError('root.server' as never, { type: 'server', message });
}
