// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QuestionFields } from '@/features/questionnaire/components/question-fields';
import { demoQuestionnaire } from '@shared/schemas/questionnaire-defaults';
import { makeStudyDefinition } from '../../../../scripts/lib/study-factory/definition';

afterEach(cleanup);

// The demo's household-size question: a required whole number of people.
const page = demoQuestionnaire(makeStudyDefinition()).pages.find((p) => p.id === 'household');
if (page?.kind !== 'question') throw new Error('The demo questionnaire has no household page');
const household = page.question;

describe('QuestionFields settings', () => {
  it('shows "required" and "whole numbers" as labelled checkboxes and reports each change', async () => {
    const onChange = vi.fn();
    render(<QuestionFields question={household} onChange={onChange} />);
    const required = screen.getByRole('checkbox', { name: 'An answer is required' });
    const whole = screen.getByRole('checkbox', { name: 'Whole numbers only' });
    expect(required).toBeChecked();
    expect(whole).toBeChecked();
    const user = userEvent.setup();
    await user.click(required);
    expect(onChange).toHaveBeenLastCalledWith({ ...household, required: false });
    await user.click(whole);
    expect(onChange).toHaveBeenLastCalledWith({ ...household, integer: false });
  });

  it('saves the range as typed, a decimal comma included, and never a number other than the one shown', async () => {
    const onChange = vi.fn();
    render(<QuestionFields question={household} onChange={onChange} />);
    const user = userEvent.setup();
    const highest = screen.getByLabelText('Highest');
    await user.clear(highest);
    await user.type(highest, '12,5');
    await user.tab();
    expect(onChange).toHaveBeenLastCalledWith({ ...household, max: 12.5 });
    onChange.mockClear();
    const lowest = screen.getByLabelText('Lowest');
    await user.clear(lowest);
    await user.type(lowest, 'one');
    await user.tab();
    expect(onChange).not.toHaveBeenCalled();
    expect(lowest).toHaveAccessibleDescription('Enter a number, such as 2.5 or 2,5');
  });
});
