/**
 * Benchmark of the design engine: a Bayesian D-efficient design for 6 attributes (three
 * with 3 levels, three with 4), 3 alternatives, 24 tasks in 3 blocks, 200 prior draws,
 * 5 random starts. Prints the time and the D-error reached; `--json` prints one JSON line.
 * Usage: npm run bench:design [-- --json]
 */
import os from 'node:os';
import { generateDesign } from '../server/engine/design/generate-design';
import { getCodedColumns } from '../shared/engine/coding/coded-columns';
import { studyDefinitionSchema } from '../shared/schemas/study-definition';

const levels = (id: string, labels: string[]) =>
  labels.map((label, l) => ({ id: `${id}${l}`, label }));

const definition = studyDefinitionSchema.parse({
  attributes: [
    {
      id: 'river',
      name: 'River health',
      kind: 'categorical',
      coding: 'effects',
      levels: levels('r', ['poor', 'fair', 'good']),
    },
    {
      id: 'cuts',
      name: 'Supply interruptions per year',
      kind: 'categorical',
      coding: 'effects',
      levels: levels('c', ['4', '2', '1']),
    },
    {
      id: 'warn',
      name: 'Taste/odour warning days',
      kind: 'categorical',
      coding: 'effects',
      levels: levels('w', ['6', '2', '0']),
    },
    {
      id: 'bill',
      name: 'Monthly bill increase',
      kind: 'categorical',
      coding: 'effects',
      levels: levels('b', ['€0', '€3', '€6', '€10']),
    },
    {
      id: 'renew',
      name: 'Renewable pumping energy',
      kind: 'categorical',
      coding: 'effects',
      levels: levels('e', ['20 %', '50 %', '65 %', '80 %']),
    },
    {
      id: 'hours',
      name: 'Help-line hours',
      kind: 'categorical',
      coding: 'effects',
      levels: levels('h', ['office', 'evenings', 'weekends', '24/7']),
    },
  ],
  alternatives: { count: 3, labeled: false, labels: [] },
});

// Ordered effects-coded priors: the first level worst, later levels better (the bill reversed).
const PRIOR_MEANS: Record<string, number[]> = {
  river: [-0.6, 0.1],
  cuts: [-0.4, 0.1],
  warn: [-0.3, 0.05],
  bill: [0.6, 0.2, -0.2],
  renew: [-0.3, -0.1, 0.1],
  hours: [-0.2, 0, 0.1],
};
const columns = getCodedColumns(definition).map((column) => {
  const attributeId = column.attributeId!;
  const index = definition.attributes
    .find((a) => a.id === attributeId)!
    .levels.findIndex((l) => l.id === column.levelId);
  const mean = PRIOR_MEANS[attributeId][index];
  return { key: column.key, mean, sd: Math.abs(mean) / 2 + 0.05 };
});

const spec = {
  method: 'd_efficient' as const,
  tasks: 24,
  blocks: 3,
  starts: 5,
  seed: 20261202,
  priors: { kind: 'bayesian' as const, columns, draws: 200 },
};

const started = process.hrtime.bigint();
const result = generateDesign(definition, spec);
const seconds = Number(process.hrtime.bigint() - started) / 1e9;
const figures = {
  bench: 'design',
  seconds: Number(seconds.toFixed(3)),
  dError: result.diagnostics.dError,
  dErrorZero: result.diagnostics.dErrorZero,
  parameters: result.diagnostics.parameters,
  tasks: result.diagnostics.tasks,
  blocks: result.diagnostics.blocks,
  draws: 200,
  starts: 5,
  cpus: os.cpus().length,
  loadAverage1m: Number(os.loadavg()[0].toFixed(2)),
};
if (process.argv.includes('--json')) {
  console.log(JSON.stringify(figures));
} else {
  console.log(
    'Bayesian D-efficient design: 6 attributes (3×3, 3×4 levels), 3 alternatives, 24 tasks, 3 blocks',
  );
  console.log(`  200 prior draws, 5 starts, ${figures.parameters} parameters`);
  console.log(
    `  time            ${seconds.toFixed(2)} s  (target < 10 s; ${figures.cpus} cores shared, load ${figures.loadAverage1m})`,
  );
  console.log(
    `  Bayesian D-error ${(figures.dError ?? Infinity).toFixed(6)}   (D0 ${(figures.dErrorZero ?? Infinity).toFixed(6)})`,
  );
}
