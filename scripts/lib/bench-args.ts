/**
 * The command line every benchmark reads: `--json` (one JSON line, nothing else on stdout),
 * `--<name> <number>` options and `--compare-with <another checkout>`; and how a benchmark's
 * main function ends (an error is printed and the exit code is 1).
 */
import path from 'node:path';

export function readBenchArgs(args: string[] = process.argv.slice(2)) {
  const asJson = args.includes('--json');
  const compareAt = args.indexOf('--compare-with');
  return {
    asJson,
    has: (flag: string) => args.includes(`--${flag}`),
    number(name: string, fallback: number): number {
      const i = args.indexOf(`--${name}`);
      return i >= 0 ? Number(args[i + 1]) : fallback;
    },
    /** The other checkout to run side by side, or null. */
    compareWith: compareAt >= 0 ? path.resolve(args[compareAt + 1]) : null,
    /** Progress lines, silent under --json. */
    log(s: string): void {
      if (!asJson) console.log(s);
    },
  };
}

export function runBench(main: () => Promise<void>): void {
  main().catch((err) => {
    console.error(err);
    process.exit(1);
  });
}
