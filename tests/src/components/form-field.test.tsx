// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it } from 'vitest';
import { act, cleanup, fireEvent, render, screen } from '@testing-library/react';
import { useForm, type UseFormReturn } from 'react-hook-form';
import { TextField } from '@/components/ui/field';
import { formField, formNumberField } from '@/components/ui/form-field';

afterEach(cleanup);

type Values = { name: string; levels: { label: string }[]; seed: number; tolerance: number };
let form: UseFormReturn<Values> | undefined;

function Harness() {
  form = useForm<Values>({
    defaultValues: { name: 'Larkspur', levels: [{ label: 'Low' }], seed: 1, tolerance: 1e-6 },
  });
  return (
    <form>
      <TextField label="Study name" {...formField(form, 'name')} />
      <TextField label="First level" {...formField(form, 'levels.0.label')} />
      <TextField label="Seed" {...formNumberField(form, 'seed')} />
      <TextField label="Tolerance" {...formNumberField(form, 'tolerance', 'decimal')} />
    </form>
  );
}

describe('formField', () => {
  it('registers the field, so typing changes the form value', () => {
    render(<Harness />);
    fireEvent.change(screen.getByLabelText('Study name'), { target: { value: 'Water bills' } });
    expect(form?.getValues('name')).toBe('Water bills');
  });

  it('shows the error set on a nested path on that field only, linked for screen readers', () => {
    render(<Harness />);
    act(() =>
      form?.setError('levels.0.label', { type: 'server', message: 'Give every level a label' }),
    );
    const level = screen.getByLabelText('First level');
    expect(level).toHaveAttribute('aria-invalid', 'true');
    expect(level).toHaveAccessibleDescription('Give every level a label');
    expect(screen.getByLabelText('Study name')).not.toHaveAttribute('aria-invalid');
  });

  it('reads a number field as a number, with the whole-number or the decimal keyboard', () => {
    render(<Harness />);
    fireEvent.change(screen.getByLabelText('Seed'), { target: { value: '42' } });
    expect(form?.getValues('seed')).toBe(42);
    expect(screen.getByLabelText('Seed')).toHaveAttribute('inputmode', 'numeric');
    const tolerance = screen.getByLabelText('Tolerance');
    expect(tolerance).toHaveAttribute('inputmode', 'decimal');
    expect(tolerance).toHaveAttribute('step', 'any');
    fireEvent.change(tolerance, { target: { value: '0.001' } });
    expect(form?.getValues('tolerance')).toBe(0.001);
  });
});
