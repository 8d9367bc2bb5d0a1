// Number formatting for the report: fixed rules so the same value always prints the same way.

/**
 * Format a value for print: 2 decimals below 1, 1 decimal below 100, none above; "–" for null/NaN.
 * Negative values use the minus sign (U+2212).
 * @example formatNumber(8.123) // '8.1'
 */
export function formatNumber(x: number | null | undefined, digits?: number): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return '–';
  const a = Math.abs(x);
  const d = digits ?? (a < 1 ? 2 : a < 100 ? 1 : 0);
  let s = x.toFixed(d);
  if (/^-0(\.0*)?$/.test(s)) s = s.slice(1);
  return s.startsWith('-') ? '−' + s.slice(1) : s;
}

/** Seconds → minutes with one decimal. */
export function formatMinutes(s: number | null | undefined): string {
  return s === null || s === undefined ? '–' : formatNumber(s / 60, 1);
}

/** Seconds → hours with one decimal. */
export function formatHours(s: number): string {
  return formatNumber(s / 3600, 1);
}

/** A setting value as typed (shortest exact decimal, at most 6 decimals): 0.1 → '0.1', 240 → '240'. */
export function formatSetting(x: number): string {
  const s = String(Math.round(x * 1e6) / 1e6);
  return s.startsWith('-') ? '−' + s.slice(1) : s;
}
