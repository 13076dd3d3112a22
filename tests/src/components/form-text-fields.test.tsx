// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it } from 'vitest';
import { act, cleanup, fireEvent, render, screen } from '@testing-library/react';
import { useForm, type UseFormReturn } from 'react-hook-form';
import { FormTextFields } from '@/components/ui/form-text-fields';

afterEach(cleanup);

type Values = { name: string; seed: number; tolerance: number };
let form: UseFormReturn<Values> | undefined;

function Harness() {
  form = useForm<Values>({ defaultValues: { name: 'Larkspur', seed: 1, tolerance: 0.5 } });
  return (
    <form>
      <FormTextFields
        form={form}
        fields={[
          { name: 'name', label: 'Study name', hint: 'For your team' },
          { name: 'seed', label: 'Seed', number: 'whole' },
          { name: 'tolerance', label: 'Tolerance', number: 'decimal' },
        ]}
      />
    </form>
  );
}

describe('FormTextFields', () => {
  it('renders one labelled input per entry, in order, with its hint', () => {
    render(<Harness />);
    const inputs = screen.getAllByRole('textbox').concat(screen.getAllByRole('spinbutton'));
    expect(inputs).toHaveLength(3);
    expect(screen.getByLabelText('Study name')).toHaveAccessibleDescription('For your team');
    expect(screen.getByLabelText('Study name')).toHaveValue('Larkspur');
  });

  it('registers text entries as text and number entries as numbers', () => {
    render(<Harness />);
    fireEvent.change(screen.getByLabelText('Study name'), { target: { value: 'Water bills' } });
    fireEvent.change(screen.getByLabelText('Seed'), { target: { value: '42' } });
    fireEvent.change(screen.getByLabelText('Tolerance'), { target: { value: '0.25' } });
    expect(form?.getValues()).toEqual({ name: 'Water bills', seed: 42, tolerance: 0.25 });
    expect(screen.getByLabelText('Seed')).toHaveAttribute('inputmode', 'numeric');
    expect(screen.getByLabelText('Tolerance')).toHaveAttribute('inputmode', 'decimal');
  });

  it('shows an error set on one entry on that input only', () => {
    render(<Harness />);
    act(() => form?.setError('seed', { type: 'server', message: 'A whole number' }));
    expect(screen.getByLabelText('Seed')).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByLabelText('Seed')).toHaveAccessibleDescription('A whole number');
    expect(screen.getByLabelText('Study name')).not.toHaveAttribute('aria-invalid');
  });
});
