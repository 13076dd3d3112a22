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
});
