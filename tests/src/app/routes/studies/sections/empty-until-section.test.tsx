// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import { MemoryRouter } from 'react-router';
import { EmptyUntilSection } from '@/app/routes/studies/sections/empty-until-section';
import { paths } from '@/config/paths';

afterEach(cleanup);

describe('EmptyUntilSection', () => {
  it('says why the section is empty and links on to the section that comes first', () => {
    render(
      <MemoryRouter>
        <EmptyUntilSection
          teamId="t1"
          studyId="s1"
          title="No taste profiles yet"
          section="models"
          label="Models"
        >
          Taste profiles come from a finished run.
        </EmptyUntilSection>
      </MemoryRouter>,
    );
    expect(screen.getByText('No taste profiles yet')).toBeVisible();
    expect(screen.getByText('Taste profiles come from a finished run.')).toBeVisible();
    expect(screen.getByRole('link', { name: 'Go to Models' })).toHaveAttribute(
      'href',
      paths.studySection.getHref('t1', 's1', 'models'),
    );
  });
});
