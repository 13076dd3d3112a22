/**
 * The registration of one react-hook-form field and its error message, in one object to spread
 * onto a TextField, SelectField, TextAreaField or an auth field: the field's name, ref and
 * handlers come from `register`, and `error` is what the form's resolver or the server
 * (`applyFieldErrors`) said about that name, nested paths included.
 */
import {
  get,
  type FieldError,
  type FieldPath,
  type FieldValues,
  type RegisterOptions,
  type UseFormReturn,
} from 'react-hook-form';

export type BoundForm<T extends FieldValues> = Pick<UseFormReturn<T>, 'register' | 'formState'>;

export function formField<T extends FieldValues, N extends FieldPath<T>>(
  form: BoundForm<T>,
  name: N,
  options?: RegisterOptions<T, N>,
) {
  const error = get(form.formState.errors, name) as FieldError | undefined;
  return { ...form.register(name, options), error: error?.message };
}

/**
 * `formField` for a number: the phone's number keyboard (whole numbers, or decimals with any
 * step) and the value read as a number, NaN when empty, for the schema to reject or default.
 */
export function formNumberField<T extends FieldValues, N extends FieldPath<T>>(
  form: BoundForm<T>,
  name: N,
  kind: 'whole' | 'decimal' = 'whole',
) {
  const keyboard =
    kind === 'whole'
      ? ({ inputMode: 'numeric' } as const)
      : ({ inputMode: 'decimal', step: 'any' } as const);
  return {
    type: 'number',
    ...keyboard,
    ...formField(form, name, { valueAsNumber: true } as RegisterOptions<T, N>),
  } as const;
}
