/**
 * The load client of the fieldwork benchmarks, in its own process so that its work is not
 * counted as the server's: reads its options (scripts/lib/respondent-load.ts, LoadOptions)
 * as JSON from the first argument, runs the simulated respondents, prints one JSON line.
 * Started by scripts/bench-fieldwork.ts and scripts/bench-faults.ts, not by hand.
 */
import { runRespondentLoad, type LoadOptions } from './lib/respondent-load';

const options = JSON.parse(process.argv[2] ?? '{}') as LoadOptions;
const result = await runRespondentLoad(options);
process.stdout.write(`${JSON.stringify(result)}\n`);
