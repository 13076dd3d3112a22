/** Okabe–Ito colour-blind-safe palette (Okabe & Ito 2008), black left out for chart series. */
export const okabeIto = [
  '#0072b2',
  '#e69f00',
  '#009e73',
  '#cc79a7',
  '#56b4e9',
  '#d55e00',
  '#f0e442',
] as const;

/** The theme's ink navy (--color-ink in src/styles/index.css), for marks drawn over coloured series. */
export const chartInk = '#14213d';

/** A palette colour with transparency, for overlaid series. */
export function withAlpha(hex: string, alpha: number): string {
  const n = parseInt(hex.slice(1), 16);
  return `rgba(${(n >> 16) & 255}, ${(n >> 8) & 255}, ${n & 255}, ${alpha})`;
}
