/**
 * The one way Choicewright writes numbers, amounts of money and dates for people to read: on
 * screen (through src/utils/format.ts), in the printable report and in e-mails. Everything
 * goes through Intl.NumberFormat and Intl.DateTimeFormat with one locale, a true minus sign
 * (U+2212) and "—" for a missing value. Machine-readable files (CSV, XLSX cells) keep plain
 * numbers and never use these functions.
 */
export const LOCALE = 'en-GB';
export const MINUS = '\u2212';
export const MISSING = '—';

const numberFormats = new Map<string, Intl.NumberFormat>();

function numberFormat(key: string, options: Intl.NumberFormatOptions): Intl.NumberFormat {
  let f = numberFormats.get(key);
  if (!f) {
    f = new Intl.NumberFormat(LOCALE, options);
    numberFormats.set(key, f);
  }
  return f;
}

const isNumber = (x: number | null | undefined): x is number =>
  x !== null && x !== undefined && Number.isFinite(x);

/** Intl writes a hyphen-minus; a value that rounds to zero loses its sign ("0.000"). */
function withMinus(text: string): string {
  const plain = text.replace(/^-/, MINUS);
  return /[1-9]/.test(plain) ? plain : plain.replace(MINUS, '');
}

/** A number with a fixed number of decimals and digit grouping: "−1,234.568". */
export function formatNumber(value: number | null | undefined, decimals = 3): string {
  if (!isNumber(value)) return MISSING;
  const f = numberFormat(`n${decimals}`, {
    minimumFractionDigits: decimals,
    maximumFractionDigits: decimals,
  });
  return withMinus(f.format(value));
}

/** A number with at most `decimals` decimals, trailing zeros dropped (levels, counts of units). */
export function formatCompact(value: number | null | undefined, decimals = 2): string {
  if (!isNumber(value)) return MISSING;
  return withMinus(numberFormat(`c${decimals}`, { maximumFractionDigits: decimals }).format(value));
}

/**
 * A number to `digits` significant digits, for figures whose scale varies from design to
 * design (D-errors, priors): 0.28413 → "0.2841", −1.5 → "−1.500".
 */
export function formatSignificant(value: number | null | undefined, digits = 4): string {
  if (!isNumber(value)) return MISSING;
  const f = numberFormat(`s${digits}`, {
    minimumSignificantDigits: digits,
    maximumSignificantDigits: digits,
  });
  return withMinus(f.format(value));
}

/** A whole count with digit grouping: "12,480". */
export function formatCount(value: number | null | undefined): string {
  return formatNumber(value === null || value === undefined ? value : Math.round(value), 0);
}

/** A fraction as a percentage: 0.1234 → "12.3%". */
export function formatPercent(fraction: number | null | undefined, decimals = 1): string {
  if (!isNumber(fraction)) return MISSING;
  const f = numberFormat(`p${decimals}`, {
    style: 'percent',
    minimumFractionDigits: decimals,
    maximumFractionDigits: decimals,
  });
  return withMinus(f.format(fraction));
}

/** A p-value: three decimals, "<0.001" below that. */
export function formatPValue(p: number | null | undefined): string {
  if (!isNumber(p)) return MISSING;
  return p < 0.001 ? '<0.001' : formatNumber(p, 3);
}

/** Currency symbols researchers type as a cost unit, and their ISO 4217 codes. */
const SYMBOLS: Record<string, string> = {
  '€': 'EUR',
  $: 'USD',
  US$: 'USD',
  '£': 'GBP',
  '¥': 'JPY',
  '₹': 'INR',
};

/** The ISO 4217 code of a cost unit ("€", "EUR", "usd"), or null when it is not money. */
export function getCurrencyCode(unit: string | null | undefined): string | null {
  const u = unit?.trim() ?? '';
  if (SYMBOLS[u]) return SYMBOLS[u];
  if (!/^[A-Za-z]{3}$/.test(u)) return null;
  // Intl formats any well-formed code; only the ones it knows as currencies are money here.
  currencies ??= new Set(Intl.supportedValuesOf('currency'));
  return currencies.has(u.toUpperCase()) ? u.toUpperCase() : null;
}

let currencies: Set<string> | undefined;

/**
 * An amount in a unit: money through Intl's currency style ("−€2.56", "€15.00"), any other
 * unit after the number ("3 days"), a bare number without a unit. With `trim`, at most
 * `decimals` decimals and no trailing zeros ("€15", as levels are shown to respondents).
 */
export function formatAmount(
  value: number | null | undefined,
  unit: string | null | undefined,
  decimals = 2,
  trim = false,
): string {
  if (!isNumber(value)) return MISSING;
  const currency = getCurrencyCode(unit);
  const min = trim ? 0 : decimals;
  if (currency) {
    // A typed symbol stays that symbol ("$15", not "US$15"); a typed code shows Intl's symbol.
    const narrow = SYMBOLS[unit?.trim() ?? ''] !== undefined;
    const f = numberFormat(`m${currency}${narrow ? 'n' : ''}${min}.${decimals}`, {
      style: 'currency',
      currency,
      currencyDisplay: narrow ? 'narrowSymbol' : 'symbol',
      minimumFractionDigits: min,
      maximumFractionDigits: decimals,
    });
    return withMinus(f.format(value));
  }
  const text = trim ? formatCompact(value, decimals) : formatNumber(value, decimals);
  const u = unit?.trim();
  return u ? `${text} ${u}` : text;
}

/** "a to b" for an interval, each end formatted alike. */
export function formatInterval(
  lower: number | null | undefined,
  upper: number | null | undefined,
  format: (x: number | null | undefined) => string = (x) => formatNumber(x),
): string {
  if (!isNumber(lower) || !isNumber(upper)) return MISSING;
  return `${format(lower)} to ${format(upper)}`;
}

/** Durations as people read them: "42 s", "8 min 05 s", "1 h 02 min". */
export function formatDuration(ms: number | null | undefined): string {
  if (!isNumber(ms)) return MISSING;
  const s = Math.round(ms / 1000);
  if (s < 60) return `${s} s`;
  const m = Math.floor(s / 60);
  if (m < 60) return `${m} min ${String(s % 60).padStart(2, '0')} s`;
  return `${Math.floor(m / 60)} h ${String(m % 60).padStart(2, '0')} min`;
}

const toDate = (at: string | Date | null | undefined): Date | null => {
  if (at === null || at === undefined || at === '') return null;
  const d = at instanceof Date ? at : new Date(at);
  return Number.isNaN(d.getTime()) ? null : d;
};

/** Formats a date (a Date or an ISO string) with `options`; a missing or invalid one is MISSING. */
function dateFormatter(options: Intl.DateTimeFormatOptions) {
  const format = new Intl.DateTimeFormat(LOCALE, options);
  return (at: string | Date | null | undefined): string => {
    const d = toDate(at);
    return d ? format.format(d) : MISSING;
  };
}

/** A calendar date: "2 Dec 2026". */
export const formatDate = dateFormatter({ dateStyle: 'medium' });

/** A date with the time of day: "2 Dec 2026, 16:44". */
export const formatDateTime = dateFormatter({ dateStyle: 'medium', timeStyle: 'short' });

/** A date and time to the second, where the order of close events matters (the audit trail). */
export const formatTimestamp = dateFormatter({ dateStyle: 'medium', timeStyle: 'medium' });

/** The time of day alone, for "updated at" notes on a page that shows today's data: "16:44". */
export const formatTime = dateFormatter({ timeStyle: 'short' });
