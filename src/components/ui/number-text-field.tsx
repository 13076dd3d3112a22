/**
 * A number typed as text on a phone's decimal keyboard (a decimal comma is read as a point,
 * src/lib/typed-number.ts) and committed when the field is left. Text that is not a number,
 * or an empty field where a number is required, commits nothing and says so under the field,
 * instead of saving another value than the one on screen.
 */
import { useState, type ComponentPropsWithoutRef } from 'react';
import { readTypedNumber } from '@/lib/typed-number';
import { TextField } from './field';

type Props = Omit<
  ComponentPropsWithoutRef<typeof TextField>,
  'value' | 'defaultValue' | 'onBlur' | 'onChange' | 'error' | 'inputMode'
> & {
  value: number | null;
  /** Called with the number, or null for an empty field when `required` is not set. */
  onCommit: (value: number | null) => void;
  required?: boolean;
  integer?: boolean;
  /** The range the number must be in, both ends included. */
  range?: { min: number; max: number };
};

export function NumberTextField({ value, onCommit, required, integer, range, ...rest }: Props) {
  const [text, setText] = useState(value === null ? '' : String(value));
  const [error, setError] = useState<string | undefined>();
  const commit = () => {
    const n = readTypedNumber(text);
    const problem =
      n === null
        ? required
          ? 'Enter a number'
          : undefined
        : Number.isNaN(n)
          ? 'Enter a number, such as 2.5 or 2,5'
          : integer && !Number.isInteger(n)
            ? 'Enter a whole number'
            : range && (n < range.min || n > range.max)
              ? `Enter a number from ${range.min} to ${range.max}`
              : undefined;
    setError(problem);
    if (!problem && n !== value) onCommit(n);
  };
  return (
    <TextField
      {...rest}
      inputMode={integer ? 'numeric' : 'decimal'}
      value={text}
      error={error}
      onChange={(e) => setText(e.target.value)}
      onBlur={commit}
    />
  );
}
