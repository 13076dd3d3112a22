// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { ScreenCaution } from '@/components/ui/screen-caution';
import { TasteCautions } from '@/features/tastes/components/taste-cautions';
import { tasteCautions } from '@shared/schemas/exports';

beforeEach(() => window.localStorage.clear());
afterEach(cleanup);

describe('ScreenCaution', () => {
  it('shows one line, keeps the full text behind Details, and remembers a dismissal per screen', () => {
    const view = render(
      <ScreenCaution screen="models" summary="Short line.">
        Full text.
      </ScreenCaution>,
    );
    expect(screen.getByText('Short line.')).toBeVisible();
    expect(screen.getByText('Details').closest('details')).not.toHaveAttribute('open');
    fireEvent.click(screen.getByRole('button', { name: 'Dismiss' }));
    expect(screen.queryByText('Short line.')).toBeNull();

    // Another visit to the same screen stays quiet; another screen still shows its caution.
    view.unmount();
    render(
      <>
        <ScreenCaution screen="models" summary="Short line.">
          Full text.
        </ScreenCaution>
        <ScreenCaution screen="tastes" summary="Other screen.">
          Other text.
        </ScreenCaution>
      </>,
    );
    expect(screen.queryByText('Short line.')).toBeNull();
    expect(screen.getByText('Other screen.')).toBeVisible();
    fireEvent.click(screen.getByRole('button', { name: 'Show caution' }));
    expect(screen.getByText('Short line.')).toBeVisible();
  });
});

describe('TasteCautions', () => {
  it('says profiles are conditional on the choices and lists every caution once', () => {
    render(<TasteCautions screen="tastes" lowDraws={3} />);
    expect(screen.getAllByRole('status')).toHaveLength(1);
    expect(screen.getByText(/conditional on each respondent/)).toBeVisible();
    expect(screen.getByText(/3 respondents are flagged/)).toBeInTheDocument();
    for (const c of tasteCautions) expect(screen.getByText(c)).toBeInTheDocument();
    expect(document.body.textContent).not.toMatch(/own tastes|no source/);
  });
});
