import type { ChangeEvent } from 'react';
import type { DesignFormValues } from './build-design-spec';

/** The settings the design form keeps as typed text (numbers are parsed when the spec is built). */
export type DesignTextKey = {
  [K in keyof DesignFormValues]-?: DesignFormValues[K] extends string ? K : never;
}[keyof DesignFormValues];

/**
 * A text input of the design settings: its typed value, the error the spec check gave at its
 * path (the spec's own name for it, where that differs from the form's) and its change.
 */
export function designTextField(
  form: {
    values: DesignFormValues;
    errors: Map<string, string>;
    onChange: (patch: Partial<DesignFormValues>) => void;
  },
  key: DesignTextKey,
  specPath: string = key,
) {
  return {
    value: form.values[key],
    error: form.errors.get(specPath),
    onChange: (e: ChangeEvent<HTMLInputElement>) => form.onChange({ [key]: e.target.value }),
  };
}
