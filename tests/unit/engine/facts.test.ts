import { describe, expect, test } from 'vitest';
import { evaluateNormalised } from '../../../src/engine/evaluate';
import { INDUSTRIAL, SERVER, spec, TELECOM } from './helpers';

describe.each([['telecom', TELECOM], ['server', SERVER], ['industrial', INDUSTRIAL]] as const)('facts of the trade — %s', (_n, raw) => {
  const r = Object.fromEntries(evaluateNormalised(spec(raw)).results.map((x) => [x.scheme, x]));
  test('two-switch: each switch sees Vin and duty stays under 50 % (Hart §7.5 [M]; Pressman, Billings & Morey ch. 2 [M])', () => {
    const t = r['two-switch']!;
    expect(t.switchPeakV).toBeCloseTo(raw.vinMaxV, 9);
    expect(t.switchCount).toBe(2);
    for (const d of [t.duty.atVinMin, t.duty.atVinNom, t.duty.atVinMax]) expect(d).toBeLessThan(0.5);
  });
  test('1:1 tertiary winding doubles the stress (Erickson & Maksimović §6.3.4 [M]; Mohan, Undeland & Robbins ch. 10 [M])', () => {
    expect(r['tertiary-winding']!.switchPeakV / r['two-switch']!.switchPeakV).toBeCloseTo(2, 9);
    expect(r['tertiary-winding']!.dutyLimit).toBeLessThan(0.5);
  });
  test('active clamp: its reset allows duty past 50 % (the controller limits it), at lower stress than the 1:1 tertiary (derived: volt-second balance; common practice)', () => {
    expect(r['active-clamp']!.details.resetDutyLimit).toBeGreaterThan(0.5);
    expect(r['active-clamp']!.switchPeakV).toBeLessThan(r['tertiary-winding']!.switchPeakV);
  });
  test('RCD clamp dissipates energy that two-switch returns (common practice)', () => {
    expect(r['rcd-clamp']!.lossesW.resetOrClamp).toBeGreaterThan(r['two-switch']!.lossesW.resetOrClamp);
  });
  test('resonant reset has the highest steady peak for a given duty (derived; Murakami & Yamasaki 1988 [M])', () => {
    expect(r['resonant-reset']!.switchPeakV).toBeGreaterThan(r['two-switch']!.switchPeakV);
    expect(r['resonant-reset']!.switchPeakV - raw.vinMaxV).toBeGreaterThanOrEqual((Math.PI / 2) * r['resonant-reset']!.details.voltSecondsV / (1 - 0.45) - 1e-6);
  });
});
