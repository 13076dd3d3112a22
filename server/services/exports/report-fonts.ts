/**
 * The app's own fonts for the printable run report, inlined as data URLs so the single HTML
 * file looks and prints the same on a machine without them (Latin subset of IBM Plex Sans
 * 400/600 and Plex Mono 400, from the @fontsource packages the client ships). Read once.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';

const require = createRequire(import.meta.url);

const FACES: [family: string, pkg: string, weight: number][] = [
  ['IBM Plex Sans', 'ibm-plex-sans', 400],
  ['IBM Plex Sans', 'ibm-plex-sans', 600],
  ['IBM Plex Mono', 'ibm-plex-mono', 400],
];

let css: string | undefined;

/** @font-face rules with the fonts inlined; empty when the packages cannot be read. */
export function getReportFontFaces(): string {
  if (css !== undefined) return css;
  try {
    css = FACES.map(([family, pkg, weight]) => {
      // The packages export only CSS, so find the folder through their index.css.
      const dir = path.dirname(require.resolve(`@fontsource/${pkg}`));
      const file = path.join(dir, 'files', `${pkg}-latin-${weight}-normal.woff2`);
      const data = readFileSync(file).toString('base64');
      return `@font-face{font-family:'${family}';font-style:normal;font-weight:${weight};font-display:swap;src:url(data:font/woff2;base64,${data}) format('woff2')}`;
    }).join('\n');
  } catch {
    css = '';
  }
  return css;
}
