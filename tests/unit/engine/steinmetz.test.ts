import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { coreLossDensityWPerM3, peakFluxForLossDensityT } from '../../../src/engine/magnetics/steinmetz';

const K = 3.98;
const ALPHA = 1.4;
const BETA = 2.6;

describe('Steinmetz Pv = k·f^α·B̂^β (Steinmetz 1892; three-parameter form [M])', () => {
  test('doubling f multiplies the loss by 2^α (from memory: the form)', () => {
    const p1 = coreLossDensityWPerM3(K, ALPHA, BETA, 100e3, 0.1);
    expect(coreLossDensityWPerM3(K, ALPHA, BETA, 200e3, 0.1) / p1).toBeCloseTo(2 ** ALPHA, 10);
  });
  test('doubling B̂ multiplies the loss by 2^β (from memory: the form)', () => {
    const p1 = coreLossDensityWPerM3(K, ALPHA, BETA, 100e3, 0.05);
    expect(coreLossDensityWPerM3(K, ALPHA, BETA, 100e3, 0.1) / p1).toBeCloseTo(2 ** BETA, 10);
  });
  test('hysteresis-law exponent 1.6 of the 1892 paper: B ×10 → loss ×10^1.6 (Steinmetz 1892, reference)', () => {
    const r = coreLossDensityWPerM3(1, 1, 1.6, 50, 1) / coreLossDensityWPerM3(1, 1, 1.6, 50, 0.1);
    expect(r).toBeCloseTo(10 ** 1.6, 8);
  });
  test('demo material: ~100 kW/m³ at 100 kHz, 100 mT (derived from the fit k = 3.98)', () => {
    expect(coreLossDensityWPerM3(K, ALPHA, BETA, 100e3, 0.1)).toBeCloseTo(1.0e5, -3);
  });
  test('peakFluxForLossDensityT inverts the law (derived)', () => {
    fc.assert(fc.property(fc.double({ min: 20e3, max: 1e6, noNaN: true }), fc.double({ min: 1e3, max: 1e6, noNaN: true }), (f, pv) => {
      const b = peakFluxForLossDensityT(K, ALPHA, BETA, f, pv);
      return Math.abs(coreLossDensityWPerM3(K, ALPHA, BETA, f, b) / pv - 1) < 1e-9;
    }));
  });
  test('rejects negative flux with a RangeError', () => {
    expect(() => coreLossDensityWPerM3(K, ALPHA, BETA, 1e5, -0.1)).toThrow(RangeError);
  });
});
