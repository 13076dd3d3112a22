/**
 * The HTML pieces of the printable run report: escaping, tables (numbers right-aligned in the
 * mono face) and the page style with the app's own fonts inlined and print rules (A4 margins,
 * no broken rows, charts kept whole).
 */
import { getReportFontFaces } from './report-fonts';

export const escapeHtml = (s: string) =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!,
  );

/** Numbers (and ranges of numbers, amounts) are right-aligned in the mono face; text left. */
const isNumeric = (c: string | number) =>
  typeof c === 'number' ||
  /^(\|s\| )?[-−+]?[€$£¥]?[\d.,]+(e[-+]?\d+)?%?( to [-−+]?[€$£¥]?[\d.,]+(e[-+]?\d+)?)?$/i.test(c) ||
  /^<0\.001$/.test(c);

/** A table; a cell given as { html } is inserted as it is (already escaped). */
export function htmlTable(head: string[], rows: (string | number | { html: string })[][]): string {
  const text = (c: string | number | { html: string }) =>
    typeof c === 'object' ? null : String(c);
  const numeric = head.map(
    (_, i) =>
      i > 0 &&
      rows.length > 0 &&
      rows.every((r) => {
        const t = text(r[i]);
        return t !== null && (isNumeric(t) || t === '—');
      }),
  );
  const cls = (i: number) => (numeric[i] ? ' class="n"' : '');
  const th = head.map((h, i) => `<th${cls(i)}>${escapeHtml(h)}</th>`).join('');
  const td = (c: string | number | { html: string }, i: number) =>
    `<td${cls(i)}>${typeof c === 'object' ? c.html : escapeHtml(String(c))}</td>`;
  const tr = rows.map((r) => `<tr>${r.map(td).join('')}</tr>`).join('');
  return `<div class="t"><table><thead><tr>${th}</tr></thead><tbody>${tr}</tbody></table></div>`;
}

const STYLE = `body{font-family:'IBM Plex Sans',system-ui,sans-serif;color:#14213d;margin:2rem auto;max-width:60rem;padding:0 1rem;line-height:1.45}
h1{font-size:1.5rem;margin:0 0 .25rem}h2{font-size:1.1rem;margin:1.75rem 0 .5rem;color:#0f5e63}h3{font-size:1rem;margin:1.25rem 0 .4rem}
table{border-collapse:collapse;width:100%;font-size:.85rem}th,td{border-bottom:1px solid #dde3ec;padding:.3rem .5rem;text-align:left;vertical-align:top}
.n{text-align:right;font-family:'IBM Plex Mono',ui-monospace,monospace;font-variant-numeric:tabular-nums;white-space:nowrap}
.t{overflow-x:auto;margin:0 -.25rem;padding:0 .25rem}td:first-child{overflow-wrap:anywhere;min-width:7rem}
.code{display:block;font-family:'IBM Plex Mono',ui-monospace,monospace;font-size:.75rem;color:#5b6477}
.unit{display:block;font-size:.75rem;color:#5b6477}
.note{font-size:.8rem;color:#5b6477}
.charts{display:grid;grid-template-columns:repeat(auto-fill,minmax(16rem,1fr));gap:.75rem 1.5rem}
figure{margin:.75rem 0}figcaption{font-size:.75rem;color:#5b6477}
.caution{border:1px solid #f0a830;background:#fdf3df;padding:.75rem 1rem;border-radius:.4rem}
@page{size:A4;margin:15mm}
@media print{body{margin:0;max-width:none;padding:0}.t{overflow:visible}h2,h3{break-after:avoid}table{break-inside:auto}tr,figure{break-inside:avoid}.caution{break-inside:avoid}}`;

export function htmlPage(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1"><title>${escapeHtml(title)}</title><style>${getReportFontFaces()}\n${STYLE}</style></head><body>${body}</body></html>`;
}
