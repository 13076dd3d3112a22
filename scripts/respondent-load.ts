/**
 * The load client of the fieldwork benchmarks, in its own process so that its work is not
 * counted as the server's: reads its options (scripts/lib/respondent-load.ts, LoadOptions)
 * as JSON from the first argument, says `ready` and waits for a line on stdin when started as
 * one of several (so that all begin together), runs the simulated respondents, prints one
 * JSON line. Started by scripts/bench-fieldwork.ts and scripts/bench-faults.ts, not by hand.
 */
import { once } from 'node:events';
import { runRespondentLoad, type LoadOptions } from './lib/respondent-load';

const options = JSON.parse(process.argv[2] ?? '{}') as LoadOptions;
if (options.part) {
  process.stdout.write('ready\n');
  await once(process.stdin, 'data');
  process.stdin.destroy();
}
const result = await runRespondentLoad(options);
process.stdout.write(`${JSON.stringify(result)}\n`);
