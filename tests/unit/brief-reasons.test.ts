import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { evaluateNormalised, demoPartsLibrary, parseSpecInput } from '../../src/engine';
import { FINDING_LEADS, plainReason } from '../../src/features/briefs/reasons';

/**
 * Briefs word every engine finding for a customer with a plain lead; a code the engine raises without one would reach
 * the customer as the bare engine text. Random requirement sets (and a parts library without a winding entry, for the
 * finding that needs it) collect the codes the engine raises.
 */
describe('customer wording of findings', () => {
  test('every finding code the engine raises on random requirement sets has a customer lead', () => {
    const seen = new Set<string>();
    const raw = fc.record({
      vinMinV: fc.double({ min: 5, max: 500, noNaN: true }), ratio: fc.double({ min: 1, max: 12, noNaN: true }),
      voutV: fc.double({ min: 1, max: 60, noNaN: true }), poutW: fc.double({ min: 0.5, max: 1500, noNaN: true }),
      fswHz: fc.double({ min: 20e3, max: 2e6, noNaN: true }), rectifier: fc.constantFrom('diode', 'synchronous'),
      targetEfficiency: fc.constantFrom(undefined, 0.95), targetUnitCost: fc.constantFrom(undefined, 1),
    });
    const bare = { ...demoPartsLibrary, windings: [] };
    fc.assert(fc.property(raw, fc.boolean(), (r, noWindings) => {
      const p = parseSpecInput({
        vinMinV: r.vinMinV, vinNomV: r.vinMinV, vinMaxV: Math.min(1500, r.vinMinV * r.ratio), voutV: r.voutV, ioutA: r.poutW / r.voutV,
        fswHz: r.fswHz, rectifier: r.rectifier, ...(r.targetEfficiency ? { targetEfficiency: r.targetEfficiency } : {}), ...(r.targetUnitCost !== undefined ? { targetUnitCost: r.targetUnitCost } : {}),
      });
      if (!p.ok) return;
      for (const res of evaluateNormalised(p.value, noWindings ? bare : demoPartsLibrary).results) for (const f of res.findings) seen.add(f.code);
    }), { numRuns: 150 });
    const missing = [...seen].filter((code) => !(code in FINDING_LEADS));
    expect(missing).toEqual([]);
    // The run saw the new engine-0.3 findings, so the check covers them.
    for (const code of ['windings-not-costed', 'low-efficiency', 'core-data-frequency']) expect(seen).toContain(code);
  });
  test('a finding reads “Lead: engine message.”', () => {
    expect(plainReason({ severity: 'warn', code: 'low-efficiency', message: 'efficiency 60.0 % at 48 V' })).toBe('Efficiency is low for any application: efficiency 60.0 % at 48 V.');
  });
});
