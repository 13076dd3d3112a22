// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import { MemoryRouter } from 'react-router';
import { StudyPipeline } from '@/features/studies/components/study-pipeline';

afterEach(cleanup);

describe('StudyPipeline', () => {
  it('links sections that exist, highlights the current one and disables the rest', () => {
    render(
      <MemoryRouter initialEntries={['/teams/t1/studies/s1/tasks']}>
        <StudyPipeline
          teamId="t1"
          studyId="s1"
          available={new Set(['attributes', 'tasks', 'preview'])}
          done={new Set(['attributes'])}
        />
      </MemoryRouter>,
    );
    const nav = screen.getByRole('navigation', { name: 'Study sections' });
    expect(nav).toBeInTheDocument();
    expect(screen.getByRole('link', { name: /Tasks/ })).toHaveAttribute('aria-current', 'page');
    expect(screen.getByRole('link', { name: /Attributes/ })).toHaveAttribute(
      'href',
      '/teams/t1/studies/s1/attributes',
    );
    expect(screen.getByRole('link', { name: /Attributes/ })).toHaveTextContent('✓');
    expect(screen.queryByRole('link', { name: /Fieldwork/ })).toBeNull();
    const fieldwork = screen.getByText('Fieldwork').closest('[aria-disabled]');
    expect(fieldwork).toHaveAttribute('aria-disabled', 'true');
    expect(fieldwork).toHaveAttribute('title', expect.stringMatching(/^Available once/));
  });
});
