/**
 * The report's SVG charts: round ticks, points placed on a linear scale, zero marked, text
 * escaped; the density chart draws the population density it is given.
 */
import { describe, expect, it } from 'vitest';
import {
  niceTicks,
  renderDensityChart,
  renderWtpChart,
} from '../../../../server/services/exports/report-charts';

describe('niceTicks', () => {
  it.each([
    [0, 1, [0, 0.2, 0.4, 0.6, 0.8, 1]],
    [-2.3, 7.9, [-2, 0, 2, 4, 6]],
    [-12, -3, [-12, -10, -8, -6, -4]],
  ])('gives round steps over [%d, %d]', (lo, hi, ticks) => {
    expect(niceTicks(lo, hi).map((t) => +t.toFixed(10))).toEqual(ticks);
  });
});

describe('renderWtpChart', () => {
  const svg = renderWtpChart(
    [
      { label: 'River <health>: good', estimate: 7.3, lower: 5.4, upper: 9.9 },
      { label: 'Supply interruptions per year', estimate: -2.1, lower: null, upper: null },
    ],
    '€',
    'Population mean WTP',
  );

  it('draws one dot per row, an interval where there is one, and the zero line', () => {
    expect(svg.match(/<circle /g)).toHaveLength(2);
    expect(svg).toContain('stroke-dasharray="3 3"');
    expect(svg).toContain('River &#60;health&#62;: good');
    expect(svg).not.toContain('<health>');
    expect(svg).toContain('€');
  });

  it('places values on one linear scale (the dot lies between the ends of its interval)', () => {
    const cx = Number(/<circle cx="([\d.]+)" cy="([\d.]+)"/.exec(svg)![1]);
    const ends = /<line x1="([\d.]+)" x2="([\d.]+)" y1="([\d.]+)" y2="\3" stroke="#0f5e63"/.exec(
      svg,
    )!;
    const [a, b] = [Number(ends[1]), Number(ends[2])];
    // (7.3 − 5.4) / (9.9 − 5.4) of the way along the interval.
    expect((cx - a) / (b - a)).toBeCloseTo((7.3 - 5.4) / (9.9 - 5.4), 2);
  });

  it('draws nothing without points', () => {
    expect(renderWtpChart([], '€', 'x')).toBe('');
  });
});

describe('renderDensityChart', () => {
  it('peaks at the mean of a normal and says what is drawn', () => {
    const svg = renderDensityChart({
      label: 'River health: good',
      distribution: 'normal',
      location: 2.5,
      spread: 1.7,
      mean: 2.5,
      sd: 1.7,
    });
    const points = [...svg.matchAll(/[ML]([\d.]+),([\d.]+)/g)].map((m) => [+m[1], +m[2]]);
    const top = points.reduce((best, p) => (p[1] < best[1] ? p : best));
    const meanX = Number(/<line x1="([\d.]+)" x2="\1" y1="22"/.exec(svg)![1]);
    expect(Math.abs(top[0] - meanX)).toBeLessThan(3);
    expect(svg).toContain('normal; mean 2.5, SD 1.7');
  });
});
