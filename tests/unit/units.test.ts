import { describe, expect, it } from 'vitest';
import { parseQuantity } from '../../src/lib/units';

describe('parseQuantity accepts what engineers type', () => {
  it.each([
    ['48', 'V', 48],
    ['48 V', 'V', 48],
    ['48V', 'V', 48],
    ['200k', 'Hz', 200e3],
    ['200 kHz', 'Hz', 200e3],
    ['1.5 MHz', 'Hz', 1.5e6],
    ['2.2u', 'F', 2.2e-6],
    ['2.2 µF', 'F', 2.2e-6],
    ['2.2 uF', 'F', 2.2e-6],
    ['470n', 'F', 470e-9],
    ['10 mA', 'A', 0.01],
    ['12,5 A', 'A', 12.5],
    ['30 %', 'ratio', 0.3],
    ['0.3', 'ratio', 0.3],
    ['20k', 'count', 20000],
    ['55 °C', 'degC', 55],
    ['1e3', 'V', 1000],
  ] as const)('%s (%s) → %s', (text, kind, value) => {
    const parsed = parseQuantity(text, kind);
    expect(parsed.ok).toBe(true);
    if (parsed.ok) expect(parsed.value).toBeCloseTo(value, 12);
  });

  it.each([
    ['', 'V', 'enter a value'],
    ['abc', 'V', 'not a number'],
    ['48 A', 'V', 'not a unit of V'],
    ['200 x', 'Hz', 'not a unit of Hz'],
    ['3 V', 'ratio', 'fraction'],
    ['2.5m', 'count', 'count'],
  ] as const)('rejects %j for %s with a plain message', (text, kind, fragment) => {
    const parsed = parseQuantity(text, kind);
    expect(parsed.ok).toBe(false);
    if (!parsed.ok) expect(parsed.message).toContain(fragment);
  });
});
