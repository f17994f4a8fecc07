import { describe, expect, test } from 'vitest';
import { E12, E24, E6, snapDown, snapUp } from '../../../src/engine/eseries';

describe('IEC 60063 E-series tables', () => {
  // IEC 60063:2015, E6 / E12 / E24 tables (via two secondary reproductions).
  test('E6 (IEC 60063:2015, E6)', () => {
    expect(E6).toEqual([1.0, 1.5, 2.2, 3.3, 4.7, 6.8]);
  });
  test('E12 (IEC 60063:2015, E12)', () => {
    expect(E12).toEqual([1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2]);
  });
  test('E24 (IEC 60063:2015, E24) — not the rounded geometric series', () => {
    expect(E24).toEqual([1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1]);
    // 2.7 and 8.2 differ from round(10^(k/24), 1) — IEC 60063:2015, E24.
    expect(Math.round(10 ** (10 / 24) * 10) / 10).toBe(2.6);
    expect(Math.round(10 ** (22 / 24) * 10) / 10).toBe(8.3);
  });
  test('each series is a subset of the next (IEC 60063:2015 construction)', () => {
    for (const v of E6) expect(E12).toContain(v);
    for (const v of E12) expect(E24).toContain(v);
  });
});

describe('snapping to the series (common practice)', () => {
  test.each([
    [2.3e-6, 'E12', 2.7e-6],
    [2.2e-6, 'E12', 2.2e-6],
    [8.3e-6, 'E12', 10e-6],
    [34e-6, 'E6', 47e-6],
    [0.95, 'E24', 1.0],
    [4.4e3, 'E24', 4.7e3],
  ] as const)('snapUp(%s, %s) = %s', (value, series, expected) => {
    expect(snapUp(value, series)).toBeCloseTo(expected, 12);
  });
  test.each([
    [2.3e3, 'E24', 2.2e3],
    [9.9, 'E12', 8.2],
    [1.0e-9, 'E6', 1.0e-9],
    [0.99, 'E6', 0.68],
  ] as const)('snapDown(%s, %s) = %s', (value, series, expected) => {
    expect(snapDown(value, series)).toBeCloseTo(expected, 12);
  });
  test('rejects non-positive values with a RangeError', () => {
    expect(() => snapUp(0, 'E6')).toThrow(RangeError);
    expect(() => snapDown(-1, 'E12')).toThrow(/positive finite/);
  });
});
