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
