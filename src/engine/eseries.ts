/**
 * IEC 60063:2015 preferred-number series (values per decade). Hard-coded because E24 is not
 * the rounded geometric series (e.g. 2.7, 3.0, 3.3 …), see IEC 60063:2015 tables.
 */
export const E6: readonly number[] = [1.0, 1.5, 2.2, 3.3, 4.7, 6.8];
/** IEC 60063:2015, E12. */
export const E12: readonly number[] = [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2];
/** IEC 60063:2015, E24. */
export const E24: readonly number[] = [
  1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0,
  3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1,
];

/** Series name → table. */
export const E_SERIES = { E6, E12, E24 } as const;
export type ESeriesName = keyof typeof E_SERIES;

function check(value: number): void {
  if (!(value > 0) || !Number.isFinite(value)) {
    throw new RangeError(`E-series snapping needs a positive finite value, got ${value}`);
  }
}

/** Relative tolerance for comparing a value against a series step (avoids 2.2 → 2.7 from float noise). */
const EPS = 1e-9;

/** Decades 10^k for k = −30…30, computed with Math.pow so that they equal the direct computation bit for bit. */
const DECADE_MIN = -30;
const DECADES = Float64Array.from({ length: 61 }, (_, k) => Math.pow(10, k + DECADE_MIN));

/** 10^⌊log10(value)⌋ (table look-up inside ±30 decades). */
function decadeOf(value: number): number {
  const k = Math.floor(Math.log10(value));
  const ix = k - DECADE_MIN;
  return ix >= 0 && ix < DECADES.length ? DECADES[ix]! : Math.pow(10, k);
}

/** `snapUp` on a series table (internal fast form; same rule). */
export function snapUpIn(value: number, table: readonly number[]): number {
  check(value);
  const decade = decadeOf(value);
  const mantissa = value / decade;
  for (let i = 0; i < table.length; i++) {
    if (table[i]! >= mantissa * (1 - EPS)) return table[i]! * decade;
  }
  return table[0]! * (decade * 10);
}

/** `snapDown` on a series table (internal fast form; same rule). */
export function snapDownIn(value: number, table: readonly number[]): number {
  check(value);
  const decade = decadeOf(value);
  const mantissa = value / decade;
  for (let i = table.length - 1; i >= 0; i--) {
    if (table[i]! <= mantissa * (1 + EPS)) return table[i]! * decade;
  }
  return table[table.length - 1]! * decade / 10;
}

/**
 * Smallest series value ≥ `value` (snap UP, for a minimum requirement such as C ≥ Cmin).
 * Rule: IEC 60063:2015 series, common practice. Example: snapUp(2.3e-6, 'E12') = 2.7e-6.
 */
export function snapUp(value: number, series: ESeriesName): number {
  return snapUpIn(value, E_SERIES[series]);
}

/**
 * Largest series value ≤ `value` (snap DOWN, for a maximum such as a clamp resistor that sets a
 * voltage limit). Common practice. Example: snapDown(2.3e3, 'E24') = 2.2e3.
 */
export function snapDown(value: number, series: ESeriesName): number {
  return snapDownIn(value, E_SERIES[series]);
}
