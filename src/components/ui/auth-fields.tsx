/**
 * The e-mail and password inputs of the sign-in and account forms: type, label and the browser's
 * autofill token (HTML Living Standard, "autocomplete" field names) are set in one place, so
 * password managers fill the saved password where one is asked for and offer a new one where
 * one is being chosen.
 */
import { forwardRef, type ComponentPropsWithoutRef, type ReactNode } from 'react';
import { TextField } from './field';

type FieldProps = Omit<
  ComponentPropsWithoutRef<typeof TextField>,
  'type' | 'autoComplete' | 'label'
> & { label?: ReactNode };

export const EmailField = forwardRef<HTMLInputElement, FieldProps>(function EmailField(
  { label = 'E-mail', ...rest },
  ref,
) {
  return <TextField ref={ref} label={label} type="email" autoComplete="email" {...rest} />;
});

export const PasswordField = forwardRef<
  HTMLInputElement,
  FieldProps & { purpose: 'current' | 'new' }
>(function PasswordField({ label = 'Password', purpose, ...rest }, ref) {
  const autoComplete = purpose === 'new' ? 'new-password' : 'current-password';
  return (
    <TextField ref={ref} label={label} type="password" autoComplete={autoComplete} {...rest} />
  );
});
