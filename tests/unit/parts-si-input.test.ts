import { describe, expect, it } from 'vitest';
import { displayValue, parseSiValue, valueText } from '../../src/features/parts/si-input';

describe('part value input', () => {
  it.each([
    ['45n', 'C', 45e-9], ['45 nC', 'C', 45e-9], ['20 mΩ', 'Ω', 20e-3], ['650 V', 'V', 650], ['1.5e-9', 'F', 1.5e-9],
    ['31 mm²', 'm²', 31e-6], ['1460mm3', 'm³', 1460e-9], ['3.98', '', 3.98], ['2,2 µF', 'F', 2.2e-6],
  ])('%s (%s) reads as %d', (text, unit, value) => {
    const parsed = parseSiValue(text, unit);
    expect(parsed.ok).toBe(true);
    if (parsed.ok) expect(parsed.value).toBeCloseTo(value, 15);
  });

  it.each([['abc', 'V'], ['5 kg', 'V'], ['', 'A'], ['12 cm²', 'm²']])('refuses %s (%s) with a message', (text, unit) => {
    const parsed = parseSiValue(text, unit);
    expect(parsed.ok).toBe(false);
  });

  it.each([[150e-12, 'F'], [0.0125, 'Ω'], [31e-6, 'm²'], [5.47e-6, 'm³'], [2.4e-3, 'm'], [1.4, '']])('form text of %d %s reads back to the same value', (value, unit) => {
    const parsed = parseSiValue(valueText(value, unit), unit);
    expect(parsed.ok && parsed.value).toBeCloseTo(value, 15);
  });

  it('shows areas in mm², not with a prefix on the square metre', () => {
    expect(displayValue(31e-6, 'm²')).toBe('31 mm²');
    expect(displayValue(35e-9, 'C')).toBe('35 nC');
  });
});
