import { describe, expect, it } from 'vitest';
import { fullLoadWindow, percentile } from '../../../scripts/lib/load-stats';

// Figures worked by hand from the definitions in scripts/lib/load-stats.ts.
describe('fullLoadWindow', () => {
  const spans: Array<[number, number]> = [
    [0, 10_000],
    [2_000, 12_000],
    [4_000, 9_000],
  ];

  it('counts only what happens while every respondent is answering', () => {
    // The window runs from the last start (4 s) to the first finish (9 s): 5 s.
    const ackAt = [1_000, 4_000, 5_000, 6_000, 7_000, 8_000, 9_000, 9_500, 11_000];
    const answers = {
      ms: [500, 10, 20, 30, 40, 50, 900],
      doneAt: [1_000, 4_500, 5_000, 6_000, 7_000, 8_500, 9_500],
    };
    const w = fullLoadWindow(spans, ackAt, answers);
    expect(w.seconds).toBe(5);
    expect(w.peakRespondentsAnswering).toBe(3);
    expect(w.answersPerSecond).toBe(Math.round(6 / 5)); // the acks at 4, 5, 6, 7, 8 and 9 s
    // The replies inside the window: 10, 20, 30, 40 and 50 ms; the ramp's 500 and the tail's 900 are not.
    expect(w.answerLatencyMs).toEqual({ count: 5, p50: 30, p95: 50, p99: 50, max: 50 });
  });

  it('reports no throughput when the respondents never all overlap', () => {
    const apart: Array<[number, number]> = [
      [0, 3_000],
      [2_000, 6_000],
      [5_000, 8_000],
    ];
    const w = fullLoadWindow(apart, [1_000, 2_500], { ms: [5], doneAt: [2_500] });
    expect(w.seconds).toBe(0);
    expect(w.peakRespondentsAnswering).toBe(2);
    expect(w.answersPerSecond).toBeNull();
    expect(w.answerLatencyMs).toBeNull();
  });
});

describe('percentile', () => {
  it('takes the nearest rank', () => {
    // Nearest-rank definition: the smallest value with at least p % of the list at or below it.
    const ten = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10];
    expect(percentile(ten, 50)).toBe(5);
    expect(percentile(ten, 99)).toBe(10);
    expect(percentile(ten, 10)).toBe(1);
  });
});
