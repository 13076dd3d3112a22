import type { UseFormSetError, FieldValues } from 'react-hook-form';
import { Alert } from '@/components/ui/feedback';
import { applyFieldErrors } from '@/lib/api-client';

/**
 * Puts a server error where the person will look: on the fields it names, or (when it names
 * none) as one message above the submit button.
 */
export function applyServerError<T extends FieldValues>(
  err: unknown,
  setError: UseFormSetError<T>,
) {
  if (applyFieldErrors(err, setError as never)) return;
  const message = err instanceof Error ? err.message : 'Something went wrong.';
  setError('root.server' as never, { type: 'server', message });
}

export function FormError({ message }: { message?: string }) {
  if (!message) return null;
  return <Alert tone="danger">{message}</Alert>;
}
