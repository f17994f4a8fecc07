import { describe, expect, test } from 'vitest';
import { parseSpecInput } from '../../../src/schemas/spec';

const GOOD = { vinMinV: 36, vinNomV: 48, vinMaxV: 75, voutV: 12, ioutA: 12.5, fswHz: 250e3 };

function messages(raw: unknown): string[] {
  const r = parseSpecInput(raw);
  return r.ok ? [] : r.errors.map((e) => e.message);
}

describe('parseSpecInput — defaults', () => {
  test('fills every documented default', () => {
    const r = parseSpecInput(GOOD);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value).toMatchObject({
      rippleRatio: 0.3, voutRippleV: 0.12, ambientC: 40, annualVolume: 1000, targetEfficiency: null, targetUnitCost: null,
      rectifier: 'diode', maxDuty: 0.75, voltageDerating: 0.8, leakageRatio: null, windingArrangement: 'non-interleaved', resetTurnsRatio: 1,
      activeClampVariant: 'high-side', overrides: {},
      schemes: ['tertiary-winding', 'rcd-clamp', 'active-clamp', 'two-switch', 'resonant-reset'],
      weights: { stress: 0.25, dutyHeadroom: 0.1, partCount: 0.15, cost: 0.25, efficiency: 0.25 },
    });
  });
  test('keeps given optional values', () => {
    const r = parseSpecInput({ ...GOOD, rectifier: 'synchronous', schemes: ['two-switch'], weights: { cost: 1 } });
    expect(r.ok && r.value.rectifier).toBe('synchronous');
    expect(r.ok && r.value.schemes).toEqual(['two-switch']);
    expect(r.ok && r.value.weights.cost).toBe(1);
    expect(r.ok && r.value.weights.stress).toBe(0.25);
  });
});

describe('parseSpecInput — plain messages naming field and reason', () => {
  test.each([
    [{ ...GOOD, vinMinV: 400, vinNomV: 350, vinMaxV: 300 }, 'vinMinV (400) must not exceed vinMaxV (300)'],
    [{ ...GOOD, vinNomV: 80 }, 'vinNomV (80) must lie between vinMinV (36) and vinMaxV (75)'],
    [{ ...GOOD, voutV: -5 }, 'voutV (-5) must be at least 0.5'],
    [{ ...GOOD, vinMaxV: 2000 }, 'vinMaxV (2000) must be at most 1500'],
    [{ ...GOOD, fswHz: 5e3 }, 'fswHz (5000) must be at least 10000'],
    [{ ...GOOD, fswHz: 6e6 }, 'fswHz (6000000) must be at most 5000000'],
    [{ ...GOOD, ioutA: Number.NaN }, 'ioutA (NaN) must be a finite number'],
    [{ ...GOOD, ioutA: Number.POSITIVE_INFINITY }, 'ioutA (Infinity) must be a finite number'],
    [{ ...GOOD, voutV: '12' }, 'voutV must be a number, got "12"'],
    [{ ...GOOD, colour: 'blue' }, 'colour is not a known field'],
    [{ ...GOOD, rectifier: 'bridge' }, 'rectifier ("bridge") must be one of "diode", "synchronous"'],
    [{ ...GOOD, schemes: ['flyback'] }, 'schemes.0 ("flyback") must be one of "tertiary-winding", "rcd-clamp", "active-clamp", "two-switch", "resonant-reset"'],
    [{ ...GOOD, annualVolume: 10.5 }, 'annualVolume (10.5) must be a whole number'],
    [{ ...GOOD, voutRippleV: 20 }, 'voutRippleV (20) must be smaller than voutV (12)'],
    [{ ...GOOD, weights: { stress: 0, dutyHeadroom: 0, partCount: 0, cost: 0, efficiency: 0 } }, 'weights must not all be zero'],
    [{ ...GOOD, overrides: { 'two-switch': { turnsRatio: -1 } } }, 'overrides.two-switch.turnsRatio (-1) must be at least 0.001'],
    [{ ...GOOD, overrides: { flyback: {} } }, 'overrides.flyback is not a known field'],
  ])('%o → %s', (raw, message) => {
    expect(messages(raw)).toContain(message);
  });
  test('a missing required field is named', () => {
    const { fswHz: _omit, ...rest } = GOOD;
    expect(messages(rest)).toEqual(['fswHz is required']);
  });
  test('several problems are all reported, one line each', () => {
    expect(messages({ vinMinV: -1, foo: 1 })).toHaveLength(7);
  });
  test('non-objects are rejected', () => {
    expect(messages([1, 2])).toEqual(['the requirement set must be a JSON object']);
    expect(messages(null)).toEqual(['the requirement set must be a JSON object']);
  });
});
