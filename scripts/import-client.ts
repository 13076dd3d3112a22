/**
 * The load client of `npm run bench:import`, run in a process of its own: signs in as the demo
 * owner, uploads the choice file for a preview, then again with the inferred set-up to save
 * it, and prints one JSON line with the wall-clock seconds of each request as the browser
 * would see them. Argument: JSON {base, credentialsFile, file, name}.
 */
import { openAsBlob } from 'node:fs';
import { signInDemo } from './lib/bench-demo-run';
import type { ImportPreview, ImportResult } from '../shared/schemas/study-import';

type Options = { base: string; credentialsFile: string; file: string; name: string };

async function post<T>(base: string, cookie: string, url: string, form: FormData): Promise<T> {
  const res = await fetch(`${base}/api${url}`, {
    method: 'POST',
    headers: { Origin: base, Cookie: cookie, Accept: 'application/json' },
    body: form,
    signal: AbortSignal.timeout(600_000),
  });
  const text = await res.text();
  if (!res.ok) throw new Error(`${url} answered ${res.status}: ${text.slice(0, 500)}`);
  return JSON.parse(text) as T;
}

async function main() {
  const options = JSON.parse(process.argv[2]) as Options;
  const { me, cookie } = await signInDemo(options.base, options.credentialsFile, 'owner');
  const url = `/teams/${me.teams[0].id}/imports`;
  const form = async (setup?: unknown) => {
    const f = new FormData();
    if (setup) f.append('setup', JSON.stringify(setup));
    f.append('choices', await openAsBlob(options.file, { type: 'text/csv' }), 'choices.csv');
    return f;
  };
  let started = performance.now();
  const preview = await post<ImportPreview>(options.base, cookie(), `${url}/preview`, await form());
  const previewSeconds = (performance.now() - started) / 1000;
  if (preview.problemCount > 0)
    throw new Error(`the bench file has problems: ${JSON.stringify(preview.problems.slice(0, 3))}`);
  started = performance.now();
  const saved = await post<ImportResult>(
    options.base,
    cookie(),
    url,
    await form({ name: options.name, attributes: preview.attributes }),
  );
  const importSeconds = (performance.now() - started) / 1000;
  console.log(JSON.stringify({ previewSeconds, importSeconds, preview, saved }));
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
