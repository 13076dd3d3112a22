// @vitest-environment jsdom
/**
 * A number field that commits on leaving it (src/components/ui/number-text-field.tsx): what is
 * saved is always the number on screen, or nothing with a message.
 */
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { NumberTextField } from '@/components/ui/number-text-field';
import { NumberRangeFields } from '@/components/ui/number-range-fields';

afterEach(cleanup);

function type(label: string, text: string) {
  const input = screen.getByLabelText(label);
  fireEvent.change(input, { target: { value: text } });
  fireEvent.blur(input);
  return input;
}

describe('NumberTextField', () => {
  it('commits a decimal comma as the number it means, on the decimal keyboard', () => {
    const onCommit = vi.fn();
    render(<NumberTextField label="Lowest" value={0} onCommit={onCommit} />);
    expect(screen.getByLabelText('Lowest')).toHaveAttribute('inputmode', 'decimal');
    type('Lowest', '1,5');
    expect(onCommit).toHaveBeenCalledWith(1.5);
  });

  it('commits nothing for text that is not a number and says so, keeping the text on screen', () => {
    const onCommit = vi.fn();
    render(<NumberTextField label="Lowest" value={0} onCommit={onCommit} />);
    const input = type('Lowest', 'ten');
    expect(onCommit).not.toHaveBeenCalled();
    expect(input).toHaveValue('ten');
    expect(input).toHaveAttribute('aria-invalid', 'true');
    expect(input).toHaveAccessibleDescription('Enter a number, such as 2.5 or 2,5');
    type('Lowest', '3');
    expect(onCommit).toHaveBeenCalledWith(3);
    expect(screen.getByLabelText('Lowest')).not.toHaveAttribute('aria-invalid');
  });

  it('commits null for an empty field, unless a number is required', () => {
    const optional = vi.fn();
    render(<NumberTextField label="At least" value={4} onCommit={optional} />);
    type('At least', ' ');
    expect(optional).toHaveBeenCalledWith(null);
    cleanup();
    const required = vi.fn();
    render(<NumberTextField label="Highest" required value={4} onCommit={required} />);
    type('Highest', '');
    expect(required).not.toHaveBeenCalled();
    expect(screen.getByLabelText('Highest')).toHaveAccessibleDescription('Enter a number');
  });

  it('asks for a whole number in its range where one is needed', () => {
    const onCommit = vi.fn();
    render(
      <NumberTextField
        label="Longest answer"
        integer
        range={{ min: 1, max: 2000 }}
        value={500}
        onCommit={onCommit}
      />,
    );
    expect(screen.getByLabelText('Longest answer')).toHaveAttribute('inputmode', 'numeric');
    type('Longest answer', '2,5');
    expect(screen.getByLabelText('Longest answer')).toHaveAccessibleDescription(
      'Enter a whole number',
    );
    type('Longest answer', '5000');
    expect(screen.getByLabelText('Longest answer')).toHaveAccessibleDescription(
      'Enter a number from 1 to 2000',
    );
    expect(onCommit).not.toHaveBeenCalled();
    type('Longest answer', '800');
    expect(onCommit).toHaveBeenCalledWith(800);
  });

  it('does not commit a number equal to the saved one', () => {
    const onCommit = vi.fn();
    render(<NumberTextField label="Lowest" value={2.5} onCommit={onCommit} />);
    type('Lowest', '2,50');
    expect(onCommit).not.toHaveBeenCalled();
  });
});

describe('NumberRangeFields', () => {
  it('commits each limit with the other kept, and an emptied one as no limit', () => {
    const onCommit = vi.fn();
    render(
      <NumberRangeFields
        labels={{ low: 'From', high: 'To' }}
        integer
        limits={{ low: 18, high: 34 }}
        onCommit={onCommit}
      />,
    );
    type('From', '25');
    expect(onCommit).toHaveBeenLastCalledWith({ low: 25, high: 34 });
    type('To', '');
    expect(onCommit).toHaveBeenLastCalledWith({ low: 18, high: null });
    type('To', '40,5');
    expect(screen.getByLabelText('To')).toHaveAccessibleDescription('Enter a whole number');
    expect(onCommit).toHaveBeenCalledTimes(2);
  });
});
