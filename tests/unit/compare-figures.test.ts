import { describe, expect, test } from 'vitest';
import { evaluateNormalised, parseSpecInput } from '../../src/engine';
import { dutiesText, FIGURES } from '../../src/features/compare/figures';

describe('Compare figures', () => {
  test('duties read as percentages, or "not reachable" where the output cannot be held (issue 17: never 134.9 %)', () => {
    expect(dutiesText({ duty: { atVinMin: 0.45, atVinNom: 0.338, atVinMax: 0.216 } })).toBe('45.0 / 33.8 / 21.6 %');
    expect(dutiesText({ duty: { atVinMin: 1.349, atVinNom: 1.01, atVinMax: 0.62 } })).toBe('not reachable at Vin min/nom; 62.0 % at Vin max');
    expect(dutiesText({ duty: { atVinMin: 1.349, atVinNom: 0.9, atVinMax: 0.62 } })).toBe('not reachable at Vin min; 62.0 % at Vin max');
    expect(dutiesText({ duty: { atVinMin: 2, atVinNom: 1.5, atVinMax: 1.2 } })).toBe('not reachable');
  });
  test('a design whose overridden turns ratio cannot reach the output shows "not reachable" on its card', () => {
    const p = parseSpecInput({ vinMinV: 36, vinNomV: 48, vinMaxV: 75, voutV: 12, ioutA: 12.5, fswHz: 250e3, overrides: { 'two-switch': { turnsRatio: 0.2 } } });
    if (!p.ok) throw new Error('spec');
    const r = evaluateNormalised(p.value).results.find((x) => x.scheme === 'two-switch')!;
    expect(r.duty.atVinMin).toBeGreaterThan(1);
    const figure = FIGURES.find((f) => f.traceKey === 'duty.atVinMin')!;
    expect(figure.value(r)).toMatch(/^not reachable/);
  });
});
