/**
 * A printable run report: one self-contained HTML page (inline styles, print rules, no
 * scripts) with what the file is about, the parameter table, fit statistics, WTP, population
 * moments, a summary of the taste profiles, the methods (priors, sampler and diagnostics for HB;
 * class-count table and class estimates for latent class) and the cautions. Every text is HTML-escaped.
 */
import type { RunContext } from '../tastes/run-context';
import { getRunSummary } from './run-summary';
import { getMethodsSections, type MethodsCell } from './methods-sections';

const escapeHtml = (s: string) =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!,
  );

const num = (x: number | null | undefined, digits = 4) =>
  x === null || x === undefined || !Number.isFinite(x) ? '—' : x.toFixed(digits);

const cell = (c: MethodsCell) =>
  typeof c === 'number' ? (Number.isInteger(c) ? String(c) : num(c)) : (c ?? '—');

/** 97.5 % quantile of the standard normal (standard normal tables). */
const Z975 = 1.959964;

/** Numbers (and ranges of numbers) are right-aligned in the mono face; text stays left. */
const isNumeric = (c: string | number) =>
  typeof c === 'number' || /^[-−+]?[\d.,]+(e[-+]?\d+)?( … [-−+]?[\d.,]+(e[-+]?\d+)?)?$/i.test(c);

function table(head: string[], rows: (string | number)[][]): string {
  const numeric = head.map(
    (_, i) => i > 0 && rows.length > 0 && rows.every((r) => isNumeric(r[i]) || r[i] === '—'),
  );
  const cls = (i: number) => (numeric[i] ? ' class="n"' : '');
  const th = head.map((h, i) => `<th${cls(i)}>${escapeHtml(h)}</th>`).join('');
  const tr = rows
    .map(
      (r) => `<tr>${r.map((c, i) => `<td${cls(i)}>${escapeHtml(String(c))}</td>`).join('')}</tr>`,
    )
    .join('');
  return `<div class="t"><table><thead><tr>${th}</tr></thead><tbody>${tr}</tbody></table></div>`;
}

const STYLE = `body{font-family:'IBM Plex Sans',system-ui,sans-serif;color:#14213d;margin:2rem auto;max-width:60rem;padding:0 1rem;line-height:1.45}
h1{font-size:1.5rem;margin:0 0 .25rem}h2{font-size:1.1rem;margin:1.75rem 0 .5rem;color:#0f5e63}
table{border-collapse:collapse;width:100%;font-size:.85rem}th,td{border-bottom:1px solid #dde3ec;padding:.3rem .5rem;text-align:left;vertical-align:top}
.n{text-align:right;font-family:'IBM Plex Mono',ui-monospace,monospace;font-variant-numeric:tabular-nums}
.t{overflow-x:auto;margin:0 -.25rem;padding:0 .25rem}td:first-child{overflow-wrap:anywhere;min-width:7rem}
.caution{border:1px solid #f0a830;background:#fdf3df;padding:.75rem 1rem;border-radius:.4rem}
@media print{body{margin:0;max-width:none}.t{overflow:visible}h2{break-after:avoid}table{break-inside:auto}tr{break-inside:avoid}.caution{break-inside:avoid}}`;

export function renderRunReport(
  ctx: RunContext,
  profiles: { count: number; lowDraws: number },
  exportedAt: Date,
): string {
  const r = ctx.results;
  const summary = getRunSummary(ctx, exportedAt);
  const facts = summary.filter(([label]) => !label.startsWith('Caution'));
  const cautions = summary.filter(([label]) => label.startsWith('Caution')).map(([, v]) => v);
  const labelOf = (name: string) =>
    ctx.header.coefficients.find((c) => c.name === name)?.label ?? name;
  const parameters = r.estimates.map((e) => {
    const se = e.robustSe ?? e.se;
    return [
      e.name,
      num(e.estimate),
      num(e.se),
      num(e.robustSe),
      se ? num(e.estimate / se, 2) : '—',
      se ? `${num(e.estimate - Z975 * se)} … ${num(e.estimate + Z975 * se)}` : '—',
    ];
  });
  const sections = [
    `<h1>Run report: ${escapeHtml(ctx.run.name || 'unnamed run')}</h1><p>${escapeHtml(ctx.study.name)}</p>`,
    `<h2>About this report</h2>${table(['Item', 'Value'], facts)}`,
    `<h2>Parameters</h2>${table(['Parameter', 'Estimate', 'SE', 'Robust SE', 't (robust)', '95 % interval (robust)'], parameters)}`,
    `<h2>Fit</h2>${table(
      ['Statistic', 'Value'],
      [
        ['Log-likelihood at zero', num(r.loglikNull, 3)],
        ['Log-likelihood', num(r.loglik, 3)],
        ['ρ²', num(r.rho2)],
        ['Adjusted ρ²', num(r.adjRho2)],
        ['AIC', num(r.aic, 2)],
        ['BIC', num(r.bic, 2)],
        ['Hit rate', num(r.hitRate, 3)],
        ['Parameters', r.parameters],
        ['Iterations', r.iterations],
      ],
    )}`,
    r.wtp && r.wtp.length > 0
      ? `<h2>Willingness to pay</h2>${table(
          [
            'Attribute',
            'WTP',
            'SE (delta method)',
            '95 % interval (delta)',
            '95 % interval (Krinsky–Robb)',
          ],
          r.wtp.map((w) => [
            labelOf(w.name),
            num(w.estimate, 3),
            num(w.se, 3),
            `${num(w.deltaLower, 3)} … ${num(w.deltaUpper, 3)}`,
            `${num(w.lower, 3)} … ${num(w.upper, 3)}`,
          ]),
        )}`
      : '',
    `<h2>Population distributions</h2>${table(
      ['Coefficient', 'Distribution', 'Mean', 'SD'],
      ctx.header.coefficients.map((c) => [
        c.label,
        c.distribution,
        num(c.populationMean),
        num(c.populationSd),
      ]),
    )}`,
    `<h2>Taste profiles</h2><p>${profiles.count} respondents have a taste profile; ${profiles.lowDraws} of them have fewer than ${ctx.header.lowDrawsThreshold} effective draws.</p>`,
    ...getMethodsSections(ctx).map(
      (m) =>
        `<h2>${escapeHtml(m.title)}</h2>${table(
          m.head,
          m.rows.map((r) => r.map(cell)),
        )}`,
    ),
    `<h2>Cautions</h2><div class="caution"><ul>${cautions.map((c) => `<li>${escapeHtml(String(c))}</li>`).join('')}</ul></div>`,
  ];
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1"><title>${escapeHtml(`Run report — ${ctx.study.name}`)}</title><style>${STYLE}</style></head><body>${sections.join('\n')}</body></html>`;
}
