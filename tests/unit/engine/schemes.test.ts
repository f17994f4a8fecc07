import { describe, expect, test } from 'vitest';
import { evaluateNormalised } from '../../../src/engine/evaluate';
import { activeClampOffStateV, equalStressDuty } from '../../../src/engine/schemes/active-clamp';
import { rcdClampLossW } from '../../../src/engine/schemes/rcd-clamp';
import { resonantDutyLimit, resonantPeakV } from '../../../src/engine/schemes/resonant-reset';
import { sweepVin } from '../../../src/engine/sweep';
import type { SchemeResult } from '../../../src/engine/result-types';
import { INDUSTRIAL, SERVER, spec, TELECOM } from './helpers';

const byScheme = (raw: Record<string, unknown>): Record<string, SchemeResult> =>
  Object.fromEntries(evaluateNormalised(spec(raw)).results.map((r) => [r.scheme, r]));

const SPECS = { telecom: TELECOM, server: SERVER, industrial: INDUSTRIAL };

describe('duty limits per scheme', () => {
  test.each([
    // [scheme, extra input, reset limit, design limit, source]
    ['tertiary-winding', { resetTurnsRatio: 1 }, 0.5, 0.45, 'Erickson & Maksimović 2nd ed. §6.3.4 [M]: D ≤ 1/(1 + Nr/Np); margin 0.05 common practice'],
    ['tertiary-winding', { resetTurnsRatio: 0.5 }, 2 / 3, 2 / 3 - 0.05, 'Mohan, Undeland & Robbins ch. 10 [M]: Dmax = 1/(1 + N3/N1)'],
    ['two-switch', {}, 0.5, 0.45, 'Hart §7.5 [M]: Dmax = 0.5; practical ≈ 0.45'],
    ['rcd-clamp', {}, 1.2 / 2.2, 0.5, 'derived: reset limit Vcl/(Vin + Vcl) with Vcl = 1.2·Vin,min at D = 0.5'],
  ] as const)('%s %o → reset %d, design %d (%s)', (scheme, extra, reset, design, _source) => {
    const r = byScheme({ ...TELECOM, ...extra })[scheme]!;
    expect(r.details.resetDutyLimit).toBeCloseTo(reset, 9);
    expect(r.dutyLimit).toBeCloseTo(design, 9);
  });
  test.each(Object.entries(SPECS))('active clamp on %s: least switch stress Vpk·Irms — equal-stress Vmax/(Vmax + Vmin), or Vmax/(3·Vmin) below it (Erickson & Maksimović §6.4.1 [M]; derived)', (_name, raw) => {
    const r = byScheme(raw)['active-clamp']!;
    const star = raw.vinMaxV / (raw.vinMaxV + raw.vinMinV);
    const high = raw.vinMaxV / (3 * raw.vinMinV);
    expect(r.dutyLimit).toBeCloseTo(Math.min(0.7, high < star ? high : star), 9);
  });
  test('resonant reset: Dmax = 1 − π·fs·√(Lm·Cr) (derived; Murakami & Yamasaki 1988 [M])', () => {
    expect(resonantDutyLimit(100e3, 1e-3, 1 / (1e-3 * (Math.PI * 100e3 * 2) ** 2))).toBeCloseTo(0.5, 12);
    const r = byScheme(TELECOM)['resonant-reset']!;
    const lm = r.details.magnetizingInductanceH;
    expect(r.details.resetDutyLimit).toBeCloseTo(1 - Math.PI * TELECOM.fswHz * Math.sqrt(lm * r.details.resonantCapacitanceF!), 9);
    expect(r.details.resetDutyLimit).toBeGreaterThanOrEqual(r.duty.atVinMin);
  });
});

describe('switch peak voltage per scheme (steady state, worst over the range)', () => {
  test.each(Object.entries(SPECS))('%s', (_name, raw) => {
    const r = byScheme(raw);
    // Erickson & Maksimović §6.3.4 [M]: Vds = Vin·(1 + Np/Nr) = 2·Vin for 1:1.
    expect(r['tertiary-winding']!.switchPeakV).toBeCloseTo(2 * raw.vinMaxV, 9);
    // Hart §7.5 [M]: each switch of the two-switch forward sees Vin.
    expect(r['two-switch']!.switchPeakV).toBeCloseTo(raw.vinMaxV, 9);
    // Derived (volt-second balance): Vds = Vin + Vcl, Vcl = 1.2·Vin·D/(1 − D) at the design duty.
    const rcd = r['rcd-clamp']!;
    // Designed for 1.2·Vin,min·Dlim/(1 − Dlim) (the switch duty, leakage commutation included, sits at the limit at
    // Vin,min); the E24 resistor snapped down holds it at √(P·R), at most that and within the snap (E24 steps ≤ 10 %, so
    // the voltage ≤ 5 % lower), and still above what the reset needs, Vin,min·D/(1 − D).
    const design = (1.2 * raw.vinMinV * rcd.dutyLimit) / (1 - rcd.dutyLimit);
    expect(rcd.clampCapacitorV!).toBeLessThanOrEqual(design * (1 + 1e-12));
    expect(rcd.clampCapacitorV!).toBeGreaterThan(design * 0.95);
    expect(rcd.clampCapacitorV!).toBeGreaterThan((raw.vinMinV * rcd.duty.atVinMin) / (1 - rcd.duty.atVinMin));
    expect(rcd.switchPeakV).toBeCloseTo(raw.vinMaxV + rcd.clampCapacitorV!, 9);
    // Derived (volt-second balance on Lm + Llk, which Cc spans): Vds = Vin/(1 − D) with the switch duty, worst end of the range.
    const ac = r['active-clamp']!;
    const ends = [raw.vinMinV / (1 - ac.duty.atVinMin), raw.vinMaxV / (1 - ac.duty.atVinMax)];
    expect(ac.switchPeakV).toBeCloseTo(Math.max(...ends), 9);
    // Without leakage: at the equal-stress duty Vds = Vin,min + Vin,max exactly; at the high-line optimum D = Vmax/(3·Vmin),
    // Vds = Vmax²/(Vmax − Vmax/3) = 1.5·Vin,max (derived).
    const free = byScheme({ ...raw, leakageRatio: 0 })['active-clamp']!;
    const star = raw.vinMaxV / (raw.vinMaxV + raw.vinMinV);
    expect(free.switchPeakV).toBeCloseTo(raw.vinMaxV / (3 * raw.vinMinV) < star ? 1.5 * raw.vinMaxV : raw.vinMinV + raw.vinMaxV, 6);
    // Derived (half-sine volt-seconds): Vds = Vin,max + Vres,pk.
    const rr = r['resonant-reset']!;
    expect(rr.switchPeakV).toBeCloseTo(raw.vinMaxV + rr.details.resonantPeakV!, 9);
  });
  test('server bus 300–410 V classes: two-switch 500–650 V, active clamp ≈ 1.5·Vmax (below Vmin + Vmax), tertiary ≥ 2·Vmax (common practice; derived)', () => {
    const r = byScheme(SERVER);
    expect(r['two-switch']!.switchRatingV).toBeGreaterThanOrEqual(500);
    expect(r['two-switch']!.switchRatingV).toBeLessThanOrEqual(650);
    // 410/(3·300) = 0.456 is below the equal-stress 0.577: the high line sets the peak, Vds = 1.5·410 = 615 V (vs 710 V).
    expect(byScheme({ ...SERVER, leakageRatio: 0 })['active-clamp']!.switchPeakV).toBeCloseTo(615, 6);
    // With leakage the high line sees a little more duty (larger IL,max).
    expect(r['active-clamp']!.switchPeakV).toBeGreaterThanOrEqual(615 - 1e-6);
    expect(r['active-clamp']!.switchPeakV).toBeLessThan(615 * 1.01);
    expect(r['tertiary-winding']!.switchStressV).toBeGreaterThan(820);
  });
  test('stress ≤ rating × derating for every feasible scheme (rule of thumb V_rating ≥ V_peak/0.8, common practice)', () => {
    for (const raw of Object.values(SPECS)) {
      for (const r of Object.values(byScheme(raw))) {
        if (r.feasible) expect(r.switchStressV).toBeLessThanOrEqual(0.8 * r.switchRatingV! + 1e-9);
      }
    }
  });
});

describe('rectifier reverse voltages', () => {
  test.each(Object.entries(SPECS))('%s', (_name, raw) => {
    const r = byScheme(raw);
    for (const s of Object.values(r)) {
      // Every scheme: D2 blocks n·Vin during the on interval (derived; Mohan, Undeland & Robbins ch. 10 [M]).
      expect(s.rectifierReverseV.freewheel).toBeCloseTo(s.turnsRatio * raw.vinMaxV, 9);
    }
    // Derived (volt-second balance): D1 blocks Vin·Ns/Nr = n·Vin for a 1:1 reset winding.
    expect(r['tertiary-winding']!.rectifierReverseV.forward).toBeCloseTo(r['tertiary-winding']!.turnsRatio * raw.vinMaxV, 9);
    // Derived (volt-second balance): n·Vin.
    expect(r['two-switch']!.rectifierReverseV.forward).toBeCloseTo(r['two-switch']!.turnsRatio * raw.vinMaxV, 9);
    // Derived (volt-second balance): n·Vcl.
    expect(r['rcd-clamp']!.rectifierReverseV.forward).toBeCloseTo(r['rcd-clamp']!.turnsRatio * r['rcd-clamp']!.clampCapacitorV!, 9);
    // Derived (volt-second balance): n·Vc = n·Vin·D/(1 − D), the larger of the two ends.
    const ac = r['active-clamp']!;
    const vc = Math.max(raw.vinMinV * ac.duty.atVinMin / (1 - ac.duty.atVinMin), raw.vinMaxV * ac.duty.atVinMax / (1 - ac.duty.atVinMax));
    expect(ac.rectifierReverseV.forward).toBeCloseTo(ac.turnsRatio * vc, 9);
    // Derived (half-sine volt-seconds): n·Vres,pk.
    const rr = r['resonant-reset']!;
    expect(rr.rectifierReverseV.forward).toBeCloseTo(rr.turnsRatio * rr.details.resonantPeakV!, 9);
  });
});

describe('active clamp U-shape and equal-stress duty (derived: volt-second balance)', () => {
  test('Vds = Vin²/(Vin − K) has its minimum 4K at Vin = 2K', () => {
    const k = 20;
    expect(activeClampOffStateV(2 * k, k)).toBeCloseTo(4 * k, 12);
    expect(activeClampOffStateV(1.5 * k, k)).toBeGreaterThan(4 * k);
    expect(activeClampOffStateV(3 * k, k)).toBeGreaterThan(4 * k);
  });
  test('equal-stress duty 75/(75 + 36) gives equal stress at both ends', () => {
    const dmax = equalStressDuty(36, 75);
    expect(dmax).toBeCloseTo(75 / 111, 12);
    const k = 36 * dmax;
    expect(activeClampOffStateV(36, k)).toBeCloseTo(111, 9);
    expect(activeClampOffStateV(75, k)).toBeCloseTo(111, 9);
  });
  test('the line sweep is U-shaped: interior minimum below both ends (equal ends without leakage)', () => {
    const pts = sweepVin(spec({ ...TELECOM, leakageRatio: 0 }), 'active-clamp', 81);
    const vs = pts.map((p) => p.switchV);
    const min = Math.min(...vs);
    const at = vs.indexOf(min);
    expect(at).toBeGreaterThan(0);
    expect(at).toBeLessThan(vs.length - 1);
    expect(vs[0]).toBeCloseTo(vs[vs.length - 1]!, 6);
  });
  test('rejects Vin ≤ K', () => {
    expect(() => activeClampOffStateV(10, 10)).toThrow(RangeError);
  });
});

describe('RCD clamp dissipation P = fs·(½·Lm·Im² + ½·Llk·Ip² − ½·C·Vcl²) (derived, energy balance)', () => {
  test.each([
    // [Lm, Im, Llk, Ip, C, Vcl, fs, expected W]; with C = 0 the textbook fs·(½·Lm·Im² + ½·Llk·Ip²)
    [1e-3, 0.5, 0, 0, 0, 100, 100e3, 12.5],
    [1e-3, 0.5, 5e-6, 4, 0, 100, 100e3, 12.5 + 4],
    [200e-6, 1, 1e-6, 10, 0, 100, 250e3, 25 + 12.5],
    // The drain node takes ½·C·Vcl² of the leakage energy first: 100 pF at 300 V is 4.5 µJ, 0.45 W at 100 kHz.
    [1e-3, 0.5, 5e-6, 4, 100e-12, 300, 100e3, 12.5 + 4 - 0.45],
    // …but never more than the leakage had.
    [1e-3, 0.5, 1e-9, 4, 100e-12, 300, 100e3, 12.5],
  ])('Lm %d H, Im %d A, Llk %d H, Ip %d A, C %d F, Vcl %d V, fs %d Hz → %d W', (lm, im, llk, ip, c, vcl, fs, w) => {
    expect(rcdClampLossW(lm, im, llk, ip, c, vcl, fs)).toBeCloseTo(w, 9);
  });
  test('magnetizing part equals (Vin·D)²/(2·Lm·fs) (derived)', () => {
    const vinD = 135;
    const lm = 4e-3;
    const fs = 130e3;
    expect(rcdClampLossW(lm, vinD / (lm * fs), 0, 0, 0, 300, fs)).toBeCloseTo((vinD * vinD) / (2 * lm * fs), 9);
  });
});

describe('resonant-reset peak (derived from half-sine volt-seconds)', () => {
  test.each([[0.45], [0.5], [0.6]])('at the reset limit Dr = %d the peak is (π/2)·Vin·D/(1 − D)', (dr) => {
    const fs = 100e3;
    const lm = 500e-6;
    const cr = ((1 - dr) / (Math.PI * fs)) ** 2 / lm;
    const vin = 48;
    expect(resonantPeakV(vin * dr, fs, lm, cr)).toBeCloseTo((Math.PI / 2) * vin * dr / (1 - dr), 9);
  });
});
