import { describe, expect, it } from 'vitest';
import { formatPercent, formatSi, formatSiRange, formatVolts } from '../../src/lib/si';

describe('SI formatting', () => {
  it.each([
    [48, 'V', '48 V'],
    [2.2e-6, 'F', '2.2 µF'],
    [200e3, 'Hz', '200 kHz'],
    [1.5e6, 'Hz', '1.5 MHz'],
    [0.0123, 'A', '12.3 mA'],
    [4.7e-9, 'F', '4.7 nF'],
    [999.96, 'V', '1 kV'],
    [-12, 'V', '-12 V'],
    [0, 'W', '0 W'],
    [Number.NaN, 'V', '— V'],
  ])('formatSi(%s, %s) = %s', (value, unit, text) => {
    expect(formatSi(value, unit)).toBe(text);
  });

  it('ranges share the unit', () => {
    expect(formatSiRange(36, 75, 'V')).toBe('36–75 V');
    expect(formatSiRange(500, 2000, 'V')).toBe('500 V – 2 kV');
  });

  it('volts: whole volts from 1 kV to 10 kV, as ratings are written', () => {
    expect(formatVolts(1073.2)).toBe('1073 V');
    expect(formatVolts(1200)).toBe('1200 V');
    expect(formatVolts(850)).toBe('850 V');
    expect(formatVolts(0.12)).toBe('120 mV');
    expect(formatVolts(12_500)).toBe('12.5 kV');
  });

  it('percent', () => {
    expect(formatPercent(0.915)).toBe('91.5 %');
  });
});
