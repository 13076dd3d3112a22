/**
 * A run of text inputs bound to one react-hook-form form, given as a list: each entry is a
 * TextField's props plus the field's name, and `number` reads the value as a number with the
 * phone's number keyboard (`formNumberField`). Forms with many plain inputs list them instead of
 * writing the same registration block once per field.
 */
import type { ComponentPropsWithoutRef } from 'react';
import type { FieldPath, FieldValues } from 'react-hook-form';
import { TextField } from './field';
import { formField, formNumberField, type BoundForm } from './form-field';

export type TextFieldSpec<T extends FieldValues> = Omit<
  ComponentPropsWithoutRef<typeof TextField>,
  'name' | 'error'
> & {
  name: FieldPath<T>;
  number?: 'whole' | 'decimal';
};

export function FormTextFields<T extends FieldValues>({
  form,
  fields,
}: {
  form: BoundForm<T>;
  fields: readonly TextFieldSpec<T>[];
}) {
  return (
    <>
      {fields.map(({ name, number, ...props }) => (
        <TextField
          key={name}
          {...props}
          {...(number ? formNumberField(form, name, number) : formField(form, name))}
        />
      ))}
    </>
  );
}
