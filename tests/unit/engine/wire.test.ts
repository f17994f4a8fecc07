import { describe, expect, test } from 'vitest';
import { awgDiameterM, awgForMaxDiameter, copperResistivity, skinDepthM } from '../../../src/engine/wire';

describe('copper resistivity (IEC 60028 via Agrawal handbook p. 970)', () => {
  test('ρ20 = 1/58 Ω·mm²/m = 1.7241 µΩ·cm', () => {
    expect(copperResistivity(20)).toBeCloseTo(1.7241e-8, 12);
  });
  test('ρ100 = 2.2662 µΩ·cm (computed from α20 = 0.00393/K)', () => {
    expect(copperResistivity(100) * 1e8).toBeCloseTo(2.2662, 3);
  });
});

describe('copper skin depth δ = √(ρ/(π·f·µ0)) (Johnson 1963 p. 58 as quoted; computed)', () => {
  test.each([
    [50e3, 20, 0.2955], [100e3, 20, 0.2090], [200e3, 20, 0.1478], [500e3, 20, 0.0935], [1e6, 20, 0.0661],
    [50e3, 100, 0.3388], [100e3, 100, 0.2396], [200e3, 100, 0.1694], [500e3, 100, 0.1071], [1e6, 100, 0.0758],
  ])('f = %d Hz, %d °C → δ = %d mm', (f, temp, mm) => {
    expect(skinDepthM(f, temp) * 1e3).toBeCloseTo(mm, 3);
  });
  test('66.1/√f mm at 20 °C, within 0.5 % of Johnson’s 6.64/√f cm (Johnson 1963 p. 58 as quoted)', () => {
    const f = 123e3;
    expect(skinDepthM(f, 20) * 1e3 * Math.sqrt(f)).toBeCloseTo(66.1, 0);
    expect(Math.abs(skinDepthM(f, 20) * 1e2 * Math.sqrt(f) / 6.64 - 1)).toBeLessThan(0.005);
  });
  test('rejects a non-positive frequency', () => {
    expect(() => skinDepthM(0)).toThrow(RangeError);
  });
});

describe('AWG diameters, ASTM B258 defining formula d = 0.005 in × 92^((36 − n)/39)', () => {
  // ASTM B258 as quoted by secondary sources; values computed from the B258 formula.
  test.each([
    [10, 2.5882], [12, 2.0525], [14, 1.6277], [16, 1.2908], [18, 1.0237], [20, 0.8118], [22, 0.6438],
    [24, 0.5106], [26, 0.4049], [28, 0.3211], [30, 0.2546], [32, 0.2019], [34, 0.1601], [36, 0.1270],
    [38, 0.1007], [40, 0.0799],
  ])('AWG %d → %d mm', (gauge, mm) => {
    expect(awgDiameterM(gauge) * 1e3).toBeCloseTo(mm, 3);
  });
  test('AWG 0000 = 0.46 in (ASTM B258 anchor)', () => {
    expect(awgDiameterM(-3) / 25.4e-3).toBeCloseTo(0.46, 4);
  });
  test('thickest strand not above 2·δ at 100 kHz, 100 °C (derived from the B258 formula)', () => {
    const n = awgForMaxDiameter(2 * skinDepthM(100e3, 100));
    expect(awgDiameterM(n)).toBeLessThanOrEqual(2 * skinDepthM(100e3, 100));
    expect(awgDiameterM(n - 1)).toBeGreaterThan(2 * skinDepthM(100e3, 100));
  });
  test('rejects a non-integer gauge', () => {
    expect(() => awgDiameterM(20.5)).toThrow(/integer/);
  });
});
