import { describe, expect, it } from 'vitest';
import { evaluate } from '../../../src/engine';

// A forced rectifier must match the rectifier kind; otherwise the design reports an unknown part
// instead of failing with NaN arithmetic (regression found while profiling the engine).
const base = { vinMinV: 36, vinNomV: 48, vinMaxV: 75, voutV: 12, ioutA: 10, fswHz: 200e3 };

describe('forced rectifier part ids', () => {
  it.each([
    ['diode', 'demo-sr-30v-a'],
    ['synchronous', 'demo-rect-sch-45v-20a'],
    ['diode', 'no-such-part'],
  ] as const)('%s rectifier with %s forced → unknown-part, not a throw', (rectifier, id) => {
    const comparison = evaluate({ ...base, rectifier, overrides: { 'two-switch': { partIds: { rectifier: id } } } });
    const result = comparison.results.find((r) => r.scheme === 'two-switch')!;
    expect(result.feasible).toBe(false);
    expect(result.findings.map((f) => f.code)).toContain('unknown-part');
  });

  it('a forced part of the right kind is used', () => {
    const comparison = evaluate({ ...base, rectifier: 'diode', overrides: { 'two-switch': { partIds: { rectifier: 'demo-rect-sch-45v-20a' } } } });
    const result = comparison.results.find((r) => r.scheme === 'two-switch')!;
    expect(result.findings.map((f) => f.code)).not.toContain('unknown-part');
    expect(result.parts.some((p) => p.partId === 'demo-rect-sch-45v-20a')).toBe(true);
  });
});
