/**
 * Benchmark of the what-if share recompute (issue target: < 100 ms for 1,000 respondents in
 * the browser). Times the one shared implementation (shared/engine/shares) on 1,000 synthetic
 * respondents twice, side by side: in Node (the server's exports) and in Debian's Chromium
 * (the browser, bundled by Vite from the same source). Prints median milliseconds and the
 * load average.
 * Usage: npm run bench:shares [-- --json] [-- --respondents N] [-- --no-browser]
 */
import os from 'node:os';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { build } from 'vite';
import { chromium } from 'playwright-core';
import { runShareBench, type ShareBenchFigures } from './lib/share-bench-core';

const { values: args } = parseArgs({
  options: {
    json: { type: 'boolean' },
    respondents: { type: 'string' },
    'no-browser': { type: 'boolean' },
  },
});
const respondents = Number(args.respondents ?? 1000);
const root = path.resolve(import.meta.dirname, '..');

async function inChromium(): Promise<ShareBenchFigures> {
  const out = await build({
    root,
    configFile: false,
    logLevel: 'silent',
    build: {
      write: false,
      minify: true,
      lib: {
        entry: path.join(root, 'scripts/lib/share-bench-core.ts'),
        name: 'ShareBench',
        formats: ['iife'],
        fileName: () => 'share-bench.js',
      },
    },
  });
  const outputs = (Array.isArray(out) ? out : [out]) as { output: { code?: string }[] }[];
  const code = outputs[0].output.find((o) => o.code)?.code;
  if (!code) throw new Error('The bundle is empty');
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
  });
  try {
    const page = await browser.newPage();
    await page.addScriptTag({ content: code });
    return await page.evaluate(
      (n) =>
        (
          window as unknown as { ShareBench: { runShareBench: typeof runShareBench } }
        ).ShareBench.runShareBench(n),
      respondents,
    );
  } finally {
    await browser.close();
  }
}

const node = runShareBench(respondents);
const browser = args['no-browser'] ? null : await inChromium();
const figures = {
  bench: 'shares',
  respondents,
  targetMs: 100,
  node,
  chromium: browser,
  loadAverage: os.loadavg().map((x) => Number(x.toFixed(2))),
  cpus: os.cpus().length,
};
if (args.json) console.log(JSON.stringify(figures));
else {
  console.log(
    `Share recompute, ${respondents} respondents (median ms; target < 100 in the browser)`,
  );
  for (const [where, f] of [
    ['Node', node],
    ['Chromium', browser],
  ] as const) {
    if (!f) continue;
    console.log(
      `  ${where}: point ${f.pointMs}, with ${f.conditionalDraws}-draw conditional interval ${f.recomputeMs}, ` +
        `11-point demand curve ${f.sweepMs}, MNL Krinsky–Robb ${f.krinskyRobbMs}, draws once per run ${f.prepareMs}`,
    );
  }
  console.log(`  load average ${figures.loadAverage.join(' ')} on ${figures.cpus} cores`);
}
