/** SI prefixes from pico to giga; µ is the micro sign users type and read. */
const PREFIXES: [number, string][] = [
  [1e9, 'G'], [1e6, 'M'], [1e3, 'k'], [1, ''], [1e-3, 'm'], [1e-6, 'µ'], [1e-9, 'n'], [1e-12, 'p'],
];

/**
 * Formats a value in base SI units with a prefix and unit: `formatSi(200e3, 'Hz')` → "200 kHz",
 * `formatSi(2.2e-6, 'F')` → "2.2 µF". `digits` is significant figures (default 3), trailing zeros dropped.
 */
export function formatSi(value: number, unit: string, digits = 3): string {
  if (!Number.isFinite(value)) return `— ${unit}`.trim();
  if (value === 0) return `0 ${unit}`.trim();
  const magnitude = Math.abs(value);
  const [scale, prefix] = PREFIXES.find(([s]) => magnitude >= s * 0.9995) ?? PREFIXES[PREFIXES.length - 1]!;
  const scaled = value / scale;
  const text = Number(scaled.toPrecision(digits)).toString();
  return `${text} ${prefix}${unit}`.trim();
}

/** A range in one unit: `formatSiRange(36, 75, 'V')` → "36–75 V". */
export function formatSiRange(low: number, high: number, unit: string, digits = 3): string {
  const lowText = formatSi(low, unit, digits);
  const highText = formatSi(high, unit, digits);
  const [lowNumber, lowUnit] = lowText.split(' ');
  const [highNumber, highUnit] = highText.split(' ');
  return lowUnit === highUnit ? `${lowNumber}–${highNumber} ${highUnit}` : `${lowText} – ${highText}`;
}

/** A fraction as a percentage: 0.915 → "91.5 %". */
export function formatPercent(fraction: number, digits = 3): string {
  return `${Number((fraction * 100).toPrecision(digits))} %`;
}

/**
 * A voltage as the trade writes converter voltages: whole volts from 1000 V to 9999 V
 * ("1073 V", "1200 V"), SI prefixes elsewhere ("48 V", "120 mV").
 */
export function formatVolts(value: number, digits = 3): string {
  if (Number.isFinite(value) && Math.abs(value) >= 1000 && Math.abs(value) < 10_000) return `${Math.round(value)} V`;
  return formatSi(value, 'V', digits);
}
