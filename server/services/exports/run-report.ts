/**
 * A printable run report: one self-contained HTML page (the app's fonts inlined, print rules,
 * no scripts) with what the file is about, the parameters under readable names, fit, WTP with
 * its unit and basis and a chart, the population distributions with density charts, a summary
 * of the taste profiles, the saved what-if scenarios (shares with intervals, a chart and the
 * welfare against the status quo), the methods and the cautions. Numbers go through shared/format.ts;
 * every text is HTML-escaped.
 */
import type { RunContext } from '../tastes/run-context';
import { getRunSummary } from './run-summary';
import { getMethodsSections, type MethodsCell } from './methods-sections';
import { escapeHtml, htmlPage, htmlTable } from './report-html';
import { renderDensityChart, renderShareChart, renderWtpChart } from './report-charts';
import type { ReportScenarios } from './report-scenarios';
import { getParameterRows } from '../../../shared/results/parameter-rows';
import { getLabelOf, getWtpHeadings } from '../../../shared/results/parameter-labels';
import { SPREAD_NOTE } from '../../../shared/results/spread';
import { getWtpUnit } from '../../../shared/engine/coding/wtp-unit';
import {
  formatAmount,
  formatCount,
  formatInterval,
  formatNumber,
  formatPercent,
  formatPValue,
} from '../../../shared/format';

const cell = (c: MethodsCell) =>
  typeof c === 'number' ? (Number.isInteger(c) ? formatCount(c) : formatNumber(c, 4)) : (c ?? '—');

const named = (label: string, sub: string | null, cls: 'code' | 'unit') => ({
  html: `${escapeHtml(label)}${sub ? `<span class="${cls}">${escapeHtml(sub)}</span>` : ''}`,
});

function parametersSection(ctx: RunContext): string {
  const bayes = ctx.results.model === 'hb';
  const rows = getParameterRows(ctx.results);
  const body = rows.map((r) => [
    named(r.part ? `${r.label} — ${r.part}` : r.label, r.name, 'code'),
    r.spread ? `|s| ${formatNumber(r.estimate, 4)}` : formatNumber(r.estimate, 4),
    formatNumber(r.se, 4),
    ...(bayes ? [] : [formatNumber(r.robustSe, 4), formatNumber(r.t, 2), formatPValue(r.p)]),
    formatInterval(r.lower, r.upper, (x) => formatNumber(x, 4)),
  ]);
  const head = bayes
    ? ['Parameter', 'Posterior mean', 'Posterior SD', '95 % interval']
    : ['Parameter', 'Estimate', 'SE', 'Robust SE', 't', 'p', '95 % interval'];
  const note = bayes
    ? 'Posterior means and SDs over the kept draws; intervals are mean ± 1.96 posterior SD.'
    : 't, p and intervals use the robust (respondent-clustered) standard errors and the normal approximation.';
  const spreads = rows.some((r) => r.spread) ? ` ${SPREAD_NOTE}` : '';
  return `<h2>Parameters</h2><p class="note">Utility (logit) scale per one-unit change of each coded column.</p>${htmlTable(head, body)}<p class="note">${escapeHtml(note + spreads)}</p>`;
}

function wtpSection(ctx: RunContext): string {
  const r = ctx.results;
  if (r.wtpWithheld) return `<h2>Willingness to pay</h2><p>${escapeHtml(r.wtpWithheld)}</p>`;
  if (!r.wtp || r.wtp.length === 0) return '';
  const unit = ctx.header.costUnit;
  const money = (x: number | null | undefined) => formatAmount(x, unit);
  const labelOf = getLabelOf(r);
  const keyOf = new Map(r.columns.map((c) => [c.coefficient, c.key]));
  const headings = getWtpHeadings(r);
  const simulated = r.model === 'hb' ? 'posterior' : 'Krinsky–Robb';
  const rows = r.wtp.map((w) => [
    named(labelOf(w.name), getWtpUnit(ctx.definition, keyOf.get(w.name) ?? ''), 'unit'),
    money(w.estimate),
    money(w.se),
    formatInterval(w.deltaLower, w.deltaUpper, money),
    formatInterval(w.lower, w.upper, money),
  ]);
  const chart = renderWtpChart(
    r.wtp.map((w) => ({
      label: labelOf(w.name),
      estimate: w.estimate,
      lower: w.lower ?? w.deltaLower,
      upper: w.upper ?? w.deltaUpper,
    })),
    unit,
    `${headings.mean} with its 95 % ${r.wtp.some((w) => w.lower !== null) ? simulated : 'delta'} interval (${unit || 'cost units'})`,
  );
  return `<h2>Willingness to pay</h2>${htmlTable(
    [
      'Attribute column · unit and basis',
      headings.mean,
      'SE (delta)',
      '95 % delta',
      `95 % ${simulated}`,
    ],
    rows,
  )}<p class="note">WTP = −β/β<sub>cost</sub>: money per change of each column, as its line says; a negative amount is money needed to accept the change.</p>${chart}`;
}

function populationSection(ctx: RunContext): string {
  const coefficients = ctx.header.coefficients;
  const random = coefficients.filter(
    (c) => c.distribution !== 'fixed' && c.distribution !== 'discrete',
  );
  const rows = coefficients.map((c) => [
    c.label,
    c.distribution.replace('_', ' '),
    formatNumber(c.populationMean, 4),
    formatNumber(c.populationSd, 4),
  ]);
  const charts = random.map((c) =>
    renderDensityChart({
      label: c.label,
      distribution: c.distribution,
      location: c.location,
      spread: c.spread,
      mean: c.populationMean,
      sd: c.populationSd,
    }),
  );
  return `<h2>Population distributions</h2>${htmlTable(['Coefficient', 'Distribution', 'Mean', 'SD'], rows)}${
    charts.length > 0
      ? `<p class="note">Population densities of the random coefficients (utility scale).</p><div class="charts">${charts.join('')}</div>`
      : ''
  }`;
}

const INTERVAL_TEXT = {
  parameter: 'draws of the estimates from their covariance (Krinsky–Robb)',
  conditional: 'draws from each respondent’s conditional distribution',
};

function welfareLine(outcome: NonNullable<ReportScenarios['scenarios'][number]['welfare']>) {
  const w = outcome.welfare;
  if (!w)
    return outcome.welfareNote
      ? `<p class="note">No welfare figure: ${escapeHtml(outcome.welfareNote)}</p>`
      : '';
  const money = (x: number | null | undefined) => formatAmount(x, w.unit);
  const interval =
    w.lower !== null
      ? ` (95 % interval ${formatInterval(w.lower, w.upper, money)}, ${w.interval === 'krinsky_robb' ? 'Krinsky–Robb draws of the estimates' : 'resampling respondents'})`
      : '';
  const population = w.population
    ? ` Over the model's whole population of tastes: ${money(w.population.mean)} per person${w.population.lower !== null ? ` (95 % interval from the estimates' covariance ${formatInterval(w.population.lower, w.population.upper, money)})` : ''}.`
    : '';
  return `<p>Welfare against “${escapeHtml(w.baseline)}” (compensating variation, log-sum formula): ${money(w.mean)} per respondent${interval}.${escapeHtml(population)}</p>`;
}

function scenariosSection(report: ReportScenarios): string {
  const head = '<h2>What-if scenarios</h2>';
  if (report.scenarios.length === 0)
    return `${head}<p class="note">No scenario is saved for this study. Scenarios saved in the Shares section are computed for this run and printed here.</p>`;
  const blocks = report.scenarios.map((sc) => {
    const defs = htmlTable(
      ['Alternative', 'Levels'],
      sc.alternatives.map((a) => [a.name, a.levels]),
    );
    if (!sc.shares)
      return `<h3>${escapeHtml(sc.name)}</h3>${defs}<p class="note">Not computed: the study no longer has a level this scenario uses (${escapeHtml(sc.error)})</p>`;
    const s = sc.shares;
    const table = htmlTable(
      ['Alternative', 'Share', '95 % interval'],
      s.names.map((name, j) => [
        name,
        formatPercent(s.shares[j]),
        formatInterval(s.lower?.[j] ?? null, s.upper?.[j] ?? null, (x) => formatPercent(x)),
      ]),
    );
    const chart = renderShareChart(
      s.names.map((name, j) => ({
        label: name,
        estimate: s.shares[j],
        lower: s.lower?.[j] ?? null,
        upper: s.upper?.[j] ?? null,
      })),
      `Predicted shares of “${sc.name}”${s.interval ? ' with 95 % intervals' : ''}`,
    );
    const interval = s.interval
      ? `Intervals from ${INTERVAL_TEXT[s.interval]}.`
      : (report.intervalNote ?? '');
    return `<h3>${escapeHtml(sc.name)}</h3>${defs}${table}${chart}<p class="note">${escapeHtml(interval)}</p>${sc.welfare ? welfareLine(sc.welfare) : ''}`;
  });
  return `${head}<p class="note">The scenarios saved in the Shares section, computed for this run. Shares are predictions from stated choices: compare scenarios with each other rather than reading them as market forecasts.</p>${blocks.join('')}`;
}

export function renderRunReport(
  ctx: RunContext,
  profiles: { count: number; lowDraws: number },
  exportedAt: Date,
  scenarios: ReportScenarios = { scenarios: [], method: null, intervalNote: null },
): string {
  const r = ctx.results;
  const summary = getRunSummary(ctx, exportedAt);
  const facts = summary.filter(([label]) => !label.startsWith('Caution'));
  const cautions = summary.filter(([label]) => label.startsWith('Caution')).map(([, v]) => v);
  const sections = [
    `<h1>Run report: ${escapeHtml(ctx.run.name || 'unnamed run')}</h1><p>${escapeHtml(ctx.study.name)}</p>`,
    `<h2>About this report</h2>${htmlTable(
      ['Item', 'Value'],
      facts.map(([label, value]) => [label, cell(value)]),
    )}`,
    parametersSection(ctx),
    `<h2>Fit</h2>${htmlTable(
      ['Statistic', 'Value'],
      [
        ['Log-likelihood at zero', formatNumber(r.loglikNull, 3)],
        ['Log-likelihood', formatNumber(r.loglik, 3)],
        ['ρ²', formatNumber(r.rho2, 4)],
        ['Adjusted ρ²', formatNumber(r.adjRho2, 4)],
        ['AIC', formatNumber(r.aic, 2)],
        ['BIC', formatNumber(r.bic, 2)],
        ['Hit rate', formatPercent(r.hitRate)],
        ['Choice observations', formatCount(r.observations)],
        ['Parameters', formatCount(r.parameters)],
        ['Iterations', formatCount(r.iterations)],
      ],
    )}`,
    wtpSection(ctx),
    populationSection(ctx),
    scenariosSection(scenarios),
    `<h2>Taste profiles</h2><p>${profiles.count} respondents have a taste profile; ${profiles.lowDraws} of them have fewer than ${ctx.header.lowDrawsThreshold} effective draws.</p>`,
    ...getMethodsSections(ctx).map(
      (m) =>
        `<h2>${escapeHtml(m.title)}</h2>${htmlTable(
          m.head,
          m.rows.map((row) => row.map(cell)),
        )}`,
    ),
    `<h2>Cautions</h2><div class="caution"><ul>${cautions.map((c) => `<li>${escapeHtml(String(c))}</li>`).join('')}</ul><p class="note">What-if shares and welfare depend on the scenarios saved in the Shares section; stated, hypothetical choices tend to overstate what people would pay.</p></div>`,
  ];
  return htmlPage(`Run report — ${ctx.study.name}`, sections.join('\n'));
}
