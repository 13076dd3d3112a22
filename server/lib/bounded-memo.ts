/**
 * A function's results remembered by argument, for values a hot path computes again and
 * again from the same few inputs (a browser's Origin header, a session's rate-limit key).
 * The memo holds at most `kept` entries and starts again when full: clients choose the
 * inputs, so it must not grow without bound, and starting again is cheaper than tracking age.
 */
export function boundedMemo<T>(compute: (input: string) => T, kept: number): (input: string) => T {
  const seen = new Map<string, T>();
  return (input) => {
    if (seen.has(input)) return seen.get(input) as T;
    if (seen.size >= kept) seen.clear();
    const value = compute(input);
    seen.set(input, value);
    return value;
  };
}
