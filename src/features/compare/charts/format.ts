import { formatSi } from '../../../lib/si';

/** Volts to 3 significant figures with an SI prefix: 45.6 V, 834 V, 1.07 kV. */
export function formatVolts(v: number): string {
  return formatSi(v, 'V', 3);
}

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

/** Time axis value (already in µs) with a sensible number of decimals. */
export function formatMicroseconds(us: number): string {
  return `${Number(us.toPrecision(3))} µs`;
}

const currencyFormats = new Map<string, Intl.NumberFormat>();

/** Money in the parts library's currency: "4.70 EUR" (ISO code, so every currency reads the same way). */
export function formatMoney(amount: number, currency: string, fractionDigits = 2): string {
  const key = `${currency}|${fractionDigits}`;
  let format = currencyFormats.get(key);
  if (!format) {
    format = new Intl.NumberFormat('en', { minimumFractionDigits: fractionDigits, maximumFractionDigits: fractionDigits });
    currencyFormats.set(key, format);
  }
  return `${format.format(amount)} ${currency}`;
}
