// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import type { ComponentProps } from 'react';
import { MemoryRouter } from 'react-router';
import { StudyPipeline } from '@/features/studies/components/study-pipeline';
import { getStepsDone } from '@/features/studies/utils/steps-done';
import { defaultQuestionnaire } from '@shared/schemas/questionnaire-defaults';
import { emptyStudyDefinition } from '@shared/schemas/study-definition';

afterEach(cleanup);

type PipelineProps = Omit<ComponentProps<typeof StudyPipeline>, 'teamId' | 'studyId'>;

/** Renders the pipeline of study s1 in team t1, at `path` when a section is current. */
function renderPipeline(props: PipelineProps, path?: string) {
  render(
    <MemoryRouter initialEntries={path ? [path] : undefined}>
      <StudyPipeline teamId="t1" studyId="s1" {...props} />
    </MemoryRouter>,
  );
}

describe('StudyPipeline', () => {
  it('links sections that exist, highlights the current one and disables the rest', () => {
    renderPipeline(
      { available: new Set(['attributes', 'tasks', 'preview']), done: new Set(['attributes']) },
      '/teams/t1/studies/s1/tasks',
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

  it('shows "Imported" where Fieldwork would be for a study made from a file, with no link', () => {
    renderPipeline({ available: new Set(['fieldwork', 'models']), imported: true });
    expect(screen.queryByText('Fieldwork')).toBeNull();
    expect(screen.queryByRole('link', { name: /Imported/ })).toBeNull();
    const step = screen.getByText('Imported').closest('[aria-disabled]');
    expect(step).toHaveAttribute('title', expect.stringMatching(/imported from a file/));
    expect(screen.getByRole('link', { name: /Models/ })).toBeInTheDocument();
  });
});

describe('getStepsDone', () => {
  const counts = { attributes: 3, tasks: 0, blocks: 0, respondents: 0 };
  const saved = defaultQuestionnaire(emptyStudyDefinition);

  it('ticks the questionnaire once saved, and the preview once tasks and questionnaire exist', () => {
    expect([...getStepsDone({ counts, questionnaire: {} })]).toEqual(['attributes']);
    expect([...getStepsDone({ counts, questionnaire: saved })]).toEqual([
      'attributes',
      'questionnaire',
    ]);
    expect([...getStepsDone({ counts: { ...counts, tasks: 16 }, questionnaire: saved })]).toEqual([
      'attributes',
      'tasks',
      'questionnaire',
      'preview',
    ]);
  });

  it('names a done step for screen readers too', () => {
    renderPipeline({
      available: new Set(['questionnaire', 'preview']),
      done: new Set(['questionnaire', 'preview']),
    });
    expect(screen.getByRole('link', { name: /^Questionnaire,\s?done$/ })).toBeInTheDocument();
    expect(screen.getByRole('link', { name: /^Preview,\s?done$/ })).toBeInTheDocument();
  });
});
