import { formatSi } from './si';

/**
 * One formatter per kind of number, for every screen, brief, mail and the CLI (so a figure reads the same wherever it
 * shows). Voltages, SI values, ranges and percentages: `./si.ts`; the rest here.
 */
export { formatPercent, formatSi, formatSiRange, formatVolts } from './si';

/** Amperes to 3 significant figures: 8.17 A, 280 mA. */
export function formatAmps(a: number): string {
  return formatSi(a, 'A', 3);
}

/** Duty (a fraction) as a percentage with one decimal: 0.375 → "37.5 %". */
export function formatDuty(d: number): string {
  return Number.isFinite(d) ? `${(d * 100).toFixed(1)} %` : '— %';
}

/** Watts with two decimals: "4.17 W". */
export function formatWatts(w: number): string {
  return Number.isFinite(w) ? `${w.toFixed(2)} W` : '— W';
}

/** Time already in µs, with a sensible number of decimals: "3.85 µs". */
export function formatMicroseconds(us: number): string {
  return `${Number(us.toPrecision(3))} µs`;
}

const currencyFormats = new Map<number, Intl.NumberFormat>();

/**
 * Money in the parts library's currency, thousands grouped, with its ISO code (every currency reads the same way):
 * 4.7 → "4.70 EUR", 12345.6 → "12,345.60 EUR"; "—" for a missing figure.
 */
export function formatMoney(amount: number, currency: string, fractionDigits = 2): string {
  if (!Number.isFinite(amount)) return `— ${currency}`;
  let format = currencyFormats.get(fractionDigits);
  if (!format) {
    format = new Intl.NumberFormat('en-US', { minimumFractionDigits: fractionDigits, maximumFractionDigits: fractionDigits });
    currencyFormats.set(fractionDigits, format);
  }
  return `${format.format(amount)} ${currency}`;
}

/** Whole numbers with thousands separators: 20000 → "20,000". */
export function formatCount(n: number): string {
  return Math.round(n).toLocaleString('en-US');
}
