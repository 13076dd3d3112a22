// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it } from 'vitest';
import { useState } from 'react';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QuotaFields } from '@/features/questionnaire/components/quota-fields';
import type { ScreeningPage } from '@shared/schemas/questionnaire';
import { requiredSingleQuestion } from '@shared/schemas/required-single-question';

afterEach(cleanup);

const regionPage: ScreeningPage = {
  id: 'p',
  kind: 'screening',
  question: requiredSingleQuestion('region', 'Where do you live?', [
    { id: 'north', label: 'North bank' },
    { id: 'south', label: 'South bank' },
    { id: 'away', label: 'Outside the valley' },
  ]),
  screenOutOptionIds: ['away'],
  acceptMin: null,
  acceptMax: null,
  quotaCells: [],
};

let latest: ScreeningPage = regionPage;
function Harness() {
  const [page, setPage] = useState(regionPage);
  latest = page;
  return <QuotaFields page={page} onChange={setPage} />;
}

describe('QuotaFields', () => {
  it('names the accepted answers no group takes until every one is in a group', async () => {
    const user = userEvent.setup();
    render(<Harness />);
    await user.click(screen.getByRole('button', { name: 'Add a quota group' }));
    // Screen-out answers are not offered: they never count towards a quota.
    const first = screen.getByRole('group', { name: 'Answers in Group 1' });
    expect(first).not.toHaveTextContent('Outside the valley');
    expect(screen.getByText('The answer "North bank" is in no quota cell')).toBeInTheDocument();
    await user.click(screen.getByRole('checkbox', { name: 'North bank' }));
    await user.click(screen.getByRole('button', { name: 'Add a quota group' }));
    const boxes = screen.getAllByRole('checkbox', { name: 'South bank' });
    await user.click(boxes[1]);
    expect(screen.queryByRole('status')).toBeNull();
    expect(latest.quotaCells.map((c) => c.optionIds)).toEqual([['north'], ['south']]);
  });

  it('keeps the completes wanted as typed, and refuses text or a fraction instead of guessing', async () => {
    const user = userEvent.setup();
    render(<Harness />);
    await user.click(screen.getByRole('button', { name: 'Add a quota group' }));
    const wanted = screen.getByLabelText('Completes wanted');
    await user.clear(wanted);
    await user.type(wanted, '150');
    await user.tab();
    expect(latest.quotaCells[0].target).toBe(150);
    for (const typed of ['many', '12,5', '0']) {
      await user.clear(wanted);
      await user.type(wanted, typed);
      await user.tab();
      expect(wanted).toHaveAttribute('aria-invalid', 'true');
      expect(latest.quotaCells[0].target).toBe(150);
    }
  });
});
