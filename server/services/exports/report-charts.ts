/**
 * Charts of the printable run report as inline SVG: drawn on the server, no scripts, so they
 * print to PDF exactly as shown. The WTP chart shows each population WTP with its 95 %
 * interval, the share chart each saved scenario's shares with theirs; the taste charts draw each random coefficient's population density over the same
 * range as the Estimates screen (shared/results/taste-density.ts).
 */
import { formatAmount, formatCompact, formatPercent } from '../../../shared/format';
import { plotRange, populationDensity } from '../../../shared/results/taste-density';

const escapeXml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

/** About `target` round tick values inside [lo, hi] (steps of 1, 2 or 5 × 10^k). */
export function niceTicks(lo: number, hi: number, target = 5): number[] {
  if (!(hi > lo)) return [lo];
  const power = 10 ** Math.floor(Math.log10((hi - lo) / target));
  // The round step whose tick count comes closest to the target.
  const step = [1, 2, 5, 10]
    .map((m) => m * power)
    .reduce((best, s) =>
      Math.abs((hi - lo) / s - target) < Math.abs((hi - lo) / best - target) ? s : best,
    );
  const ticks: number[] = [];
  for (let t = Math.ceil(lo / step) * step; t <= hi + step * 1e-9; t += step)
    ticks.push(Math.abs(t) < step * 1e-9 ? 0 : t);
  return ticks;
}

const INK = '#14213d';
const MUTED = '#5b6477';
const LINE = '#dde3ec';
const ACCENT = '#0f5e63';

function axis(
  x: (v: number) => number,
  ticks: number[],
  y: number,
  label: (v: number) => string,
): string {
  return ticks
    .map(
      (t) =>
        `<line x1="${x(t)}" x2="${x(t)}" y1="${y}" y2="${y + 4}" stroke="${MUTED}"/>` +
        `<text x="${x(t)}" y="${y + 16}" text-anchor="middle" font-size="11" fill="${MUTED}">${escapeXml(label(t))}</text>`,
    )
    .join('');
}

export interface WtpPoint {
  label: string;
  estimate: number;
  lower: number | null;
  upper: number | null;
}

/**
 * Dot-and-interval chart, one row per item: WTP per attribute column (zero marked, money axis)
 * and the shares of a what-if scenario (fixed 0–100 % axis).
 */
function renderIntervalChart(
  points: readonly WtpPoint[],
  title: string,
  tick: (v: number) => string,
  range?: [number, number],
): string {
  if (points.length === 0) return '';
  const W = 900;
  const left = 300;
  const right = 20;
  const row = 26;
  const H = 24 + points.length * row + 28;
  let lo: number;
  let hi: number;
  if (range) [lo, hi] = range;
  else {
    const values = points.flatMap((p) => [
      p.estimate,
      p.lower ?? p.estimate,
      p.upper ?? p.estimate,
      0,
    ]);
    lo = Math.min(...values);
    hi = Math.max(...values);
    const pad = (hi - lo || 1) * 0.06;
    lo -= pad;
    hi += pad;
  }
  const x = (v: number) => +(left + ((v - lo) / (hi - lo)) * (W - left - right)).toFixed(1);
  const bottom = 16 + points.length * row;
  const rows = points
    .map((p, i) => {
      const y = 16 + i * row + row / 2;
      const interval =
        p.lower !== null && p.upper !== null
          ? `<line x1="${x(p.lower)}" x2="${x(p.upper)}" y1="${y}" y2="${y}" stroke="${ACCENT}" stroke-width="2"/>`
          : '';
      const name = p.label.length > 44 ? `${p.label.slice(0, 43)}…` : p.label;
      return (
        `<text x="${left - 8}" y="${y + 4}" text-anchor="end" font-size="12" fill="${INK}">${escapeXml(name)}</text>` +
        interval +
        `<circle cx="${x(p.estimate)}" cy="${y}" r="4" fill="${ACCENT}"/>`
      );
    })
    .join('');
  return (
    `<figure class="chart"><svg viewBox="0 0 ${W} ${H}" width="100%" role="img" aria-label="${escapeXml(title)}" xmlns="http://www.w3.org/2000/svg">` +
    `<line x1="${x(0)}" x2="${x(0)}" y1="12" y2="${bottom}" stroke="${MUTED}" stroke-dasharray="3 3"/>` +
    rows +
    `<line x1="${left}" x2="${W - right}" y1="${bottom}" y2="${bottom}" stroke="${LINE}"/>` +
    axis(x, niceTicks(lo, hi), bottom, tick) +
    `</svg><figcaption>${escapeXml(title)}</figcaption></figure>`
  );
}

/** WTP per attribute column with its 95 % interval, zero marked. */
export function renderWtpChart(points: readonly WtpPoint[], unit: string, title: string): string {
  return renderIntervalChart(points, title, (v) => formatAmount(v, unit, 2, true));
}

/** The shares of one what-if scenario with their 95 % intervals, on a 0–100 % axis. */
export function renderShareChart(points: readonly WtpPoint[], title: string): string {
  return renderIntervalChart(points, title, (v) => formatPercent(v, 0), [0, 1]);
}

export interface DensityInput {
  label: string;
  distribution: string;
  location: number;
  spread: number;
  mean: number;
  sd: number;
}

/** The population density of one random coefficient (utility scale), mean marked. */
export function renderDensityChart(c: DensityInput): string {
  const W = 320;
  const H = 150;
  const left = 10;
  const right = 10;
  const top = 22;
  const bottom = H - 26;
  const [lo, hi] = plotRange(c, []);
  const n = 120;
  const xs = Array.from({ length: n + 1 }, (_, i) => lo + ((hi - lo) * i) / n);
  const ys = xs.map((v) => populationDensity(c, v));
  const peak = Math.max(...ys.filter(Number.isFinite), 1e-12);
  const x = (v: number) => +(left + ((v - lo) / (hi - lo)) * (W - left - right)).toFixed(1);
  const y = (d: number) => +(bottom - (Math.min(d, peak) / peak) * (bottom - top)).toFixed(1);
  const path = xs
    .map((v, i) => `${i === 0 ? 'M' : 'L'}${x(v)},${y(Number.isFinite(ys[i]) ? ys[i] : 0)}`)
    .join(' ');
  const name = c.label.length > 44 ? `${c.label.slice(0, 43)}…` : c.label;
  return (
    `<figure class="chart density"><svg viewBox="0 0 ${W} ${H}" width="100%" role="img" aria-label="${escapeXml(`Population distribution of ${c.label}`)}" xmlns="http://www.w3.org/2000/svg">` +
    `<text x="${left}" y="14" font-size="12" fill="${INK}">${escapeXml(name)}</text>` +
    `<path d="${path} L${x(hi)},${bottom} L${x(lo)},${bottom} Z" fill="${ACCENT}" fill-opacity="0.12" stroke="none"/>` +
    `<path d="${path}" fill="none" stroke="${ACCENT}" stroke-width="1.5"/>` +
    (c.mean >= lo && c.mean <= hi
      ? `<line x1="${x(c.mean)}" x2="${x(c.mean)}" y1="${top}" y2="${bottom}" stroke="${INK}" stroke-dasharray="3 3"/>`
      : '') +
    `<line x1="${left}" x2="${W - right}" y1="${bottom}" y2="${bottom}" stroke="${LINE}"/>` +
    axis(x, niceTicks(lo, hi, 4), bottom, (v) => formatCompact(v, 2)) +
    `</svg><figcaption>${escapeXml(c.distribution.replace('_', ' '))}; mean ${formatCompact(c.mean, 3)}, SD ${formatCompact(c.sd, 3)} (dashed: mean)</figcaption></figure>`
  );
}
