import { Alert } from '@/components/ui/feedback';

/** The form's own error (one that names no field), above the submit button. */
export function FormError({ message }: { message?: string }) {
  if (!message) return null;
  return <Alert tone="danger">{message}</Alert>;
}
