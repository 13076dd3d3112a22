/**
 * The e-mail and password inputs of the sign-in and account forms: type, label and the browser's
 * autofill token (HTML Living Standard, "autocomplete" field names) are set in one place, so
 * password managers fill the saved password where one is asked for and offer a new one where
 * one is being chosen.
 */
import { forwardRef, type ComponentPropsWithoutRef, type ReactNode } from 'react';
import type { FieldPath, FieldValues } from 'react-hook-form';
import { z } from 'zod';
import { TextField } from './field';
import { formField, type BoundForm } from './form-field';

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

/**
 * A new password and its repeat, for choosing one: the repeat is checked only in the browser
 * (`repeatedPasswordSchema`), as the server sees one password.
 */
export function NewPasswordFields<T extends FieldValues>({
  form,
  name,
  label = 'New password',
  hint,
}: {
  form: BoundForm<T>;
  /** The field of the new password; its repeat is always `confirmPassword`. */
  name: FieldPath<T>;
  label?: string;
  hint: string;
}) {
  return (
    <>
      <PasswordField purpose="new" label={label} hint={hint} {...formField(form, name)} />
      <PasswordField
        purpose="new"
        label="Repeat the new password"
        {...formField(form, 'confirmPassword' as FieldPath<T>)}
      />
    </>
  );
}

/** Adds the repeat of the password in `key` to a form schema; the two must be the same. */
export function repeatedPasswordSchema<S extends z.ZodRawShape>(shape: S, key: keyof S & string) {
  return z.object({ ...shape, confirmPassword: z.string() }).refine(
    (v) => {
      const values = v as Record<string, unknown>;
      return values[key] === values.confirmPassword;
    },
    {
      path: ['confirmPassword'],
      message: 'The two passwords differ',
    },
  );
}
