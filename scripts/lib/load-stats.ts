/** Summaries of benchmark timings. */

/** Nearest-rank percentile of a sorted list. */
export function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return NaN;
  const rank = Math.max(1, Math.ceil((p / 100) * sorted.length));
  return Number(sorted[rank - 1].toFixed(1));
}

export function latencySummary(ms: number[]) {
  const sorted = [...ms].sort((a, b) => a - b);
  return {
    count: sorted.length,
    p50: percentile(sorted, 50),
    p95: percentile(sorted, 95),
    p99: percentile(sorted, 99),
    max: percentile(sorted, 100),
  };
}

/** Samples the 1-minute load average every second until stopped: the machine is shared. */
export function sampleLoadAverage(loadavg: () => number[]) {
  const samples: number[] = [loadavg()[0]];
  const timer = setInterval(() => samples.push(loadavg()[0]), 1000);
  return {
    stop() {
      clearInterval(timer);
      samples.push(loadavg()[0]);
      const mean = samples.reduce((a, b) => a + b, 0) / samples.length;
      return {
        start: Number(samples[0].toFixed(2)),
        end: Number(samples[samples.length - 1].toFixed(2)),
        mean: Number(mean.toFixed(2)),
        max: Number(Math.max(...samples).toFixed(2)),
      };
    },
  };
}

/**
 * Throughput and answer latency while every respondent is answering at once ("500 concurrent
 * respondents"): from the moment the last one has started until the first one has finished.
 * With a ramp longer than one respondent's session the arrivals never all overlap; then the
 * window is shorter than a second, its figures are null and only the peak number of
 * respondents answering at the same time is reported.
 * `answers` are the answer requests' latencies with the time each got its final reply.
 */
export function fullLoadWindow(
  spans: Array<[number, number]>,
  ackAt: number[],
  answers: { ms: number[]; doneAt: number[] },
) {
  let peak = 0;
  const events = spans.flatMap(([a, b]) => [
    [a, 1],
    [b, -1],
  ]);
  events.sort((x, y) => x[0] - y[0] || x[1] - y[1]);
  let active = 0;
  for (const [, d] of events) peak = Math.max(peak, (active += d));
  const from = Math.max(...spans.map((s) => s[0]));
  const to = Math.min(...spans.map((s) => s[1]));
  const seconds = Math.max(0, (to - from) / 1000);
  const inWindow = (t: number) => t >= from && t <= to;
  const stored = ackAt.filter(inWindow).length;
  const latencies = answers.ms.filter((_, i) => inWindow(answers.doneAt[i]));
  const enough = seconds >= 1;
  return {
    peakRespondentsAnswering: peak,
    seconds: Number(seconds.toFixed(2)),
    answersPerSecond: enough ? Math.round(stored / seconds) : null,
    answerLatencyMs: enough ? latencySummary(latencies) : null,
  };
}
