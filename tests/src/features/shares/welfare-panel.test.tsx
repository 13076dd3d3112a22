// @vitest-environment jsdom
import '@testing-library/jest-dom/vitest';
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import type { ShareResult, ShareWelfare } from '@shared/schemas/shares';
import { WelfarePanel } from '@/features/shares/components/welfare-panel';

afterEach(cleanup);

const result = (over: Partial<ShareResult>) =>
  ({
    runId: 'r',
    method: 'conditional_means',
    respondents: 400,
    alternatives: [],
    segments: null,
    welfare: null,
    welfareNote: null,
    ...over,
  }) as ShareResult;

const welfare = (over: Partial<ShareWelfare>): ShareWelfare => ({
  baseline: 'Keep the current service',
  money: 'Monthly bill increase',
  unit: '€',
  mean: 4.2,
  lower: 3.9,
  upper: 4.6,
  interval: 'respondent_resampling',
  respondents: 398,
  withheld: 2,
  population: null,
  populationNote: null,
  ...over,
});

describe('WelfarePanel', () => {
  it('states the CV in the cost money with its interval and what the interval covers', () => {
    render(
      <WelfarePanel
        result={result({
          welfare: welfare({}),
        })}
      />,
    );
    expect(screen.getByText('€4.20')).toBeInTheDocument();
    expect(screen.getByText('€3.90 to €4.60')).toBeInTheDocument();
    expect(document.body.textContent).toMatch(/2 without a negative cost coefficient left out/);
    expect(document.body.textContent).toMatch(/not the estimation error/);
  });

  it("shows a mixed logit's population figure with its interval from the estimates", () => {
    render(
      <WelfarePanel
        result={result({
          welfare: welfare({ withheld: 0, population: { mean: 4.5, lower: 3.1, upper: 6.2 } }),
        })}
      />,
    );
    expect(screen.getByText('€4.50')).toBeInTheDocument();
    expect(screen.getByText('€3.10 to €6.20')).toBeInTheDocument();
    expect(document.body.textContent).toMatch(/interval from the estimates' covariance/);
    expect(document.body.textContent).toMatch(/carries their estimation error/);
  });

  it('says why no figure is given', () => {
    render(<WelfarePanel result={result({ welfareNote: 'The run has no cost coefficient.' })} />);
    expect(screen.getByText(/No welfare figure: The run has no cost coefficient/)).toBeVisible();
  });
});
