/**
 * The command line every benchmark shares: `--json` prints the one JSON result line and nothing
 * else, `--name value` sets a number or a path, a bare `--flag` switches something on, and the
 * progress log stays quiet under `--json` so the line can be piped.
 */
import path from 'node:path';

export type BenchCli = ReturnType<typeof readBenchCli>;

export function readBenchCli(
  argv: string[] = process.argv.slice(2),
  { timestamps = false }: { timestamps?: boolean } = {},
) {
  const asJson = argv.includes('--json');
  const valueOf = (name: string) => {
    const i = argv.indexOf(`--${name}`);
    return i >= 0 ? argv[i + 1] : undefined;
  };
  return {
    asJson,
    has: (flag: string) => argv.includes(`--${flag}`),
    /** The text after `--name`, or undefined when the option is not given. */
    text: valueOf,
    number: (name: string, fallback: number) => {
      const v = valueOf(name);
      return v === undefined ? fallback : Number(v);
    },
    /** A path option resolved against the working directory, or null when not given. */
    path: (name: string) => {
      const v = valueOf(name);
      return v === undefined ? null : path.resolve(v);
    },
    log: (line: string) => {
      if (asJson) return;
      console.log(timestamps ? `${new Date().toISOString().slice(11, 19)} ${line}` : line);
    },
  };
}

/** Runs a benchmark's main; an error is printed and the process exits with status 1. */
export function runBench(main: () => Promise<void>): void {
  main().catch((err) => {
    console.error(err);
    process.exit(1);
  });
}
