import { describe, expect, test } from 'vitest';
import { evaluateNormalised } from '../../../src/engine/evaluate';
import { SCHEME_IDS } from '../../../src/engine/scheme-ids';
import { sweepVin } from '../../../src/engine/sweep';
import { waveforms, type WavePoint } from '../../../src/engine/waveforms';
import { spec, TELECOM } from './helpers';

/** Trapezoidal average over the first period. */
function average(points: WavePoint[], periodS: number): number {
  let area = 0;
  for (let k = 1; k < points.length; k++) {
    const a = points[k - 1]!;
    const b = points[k]!;
    if (b.tS > periodS + 1e-15) break;
    area += ((a.value + b.value) / 2) * (b.tS - a.tS);
  }
  return area / periodS;
}

describe('idealised waveforms', () => {
  const s = spec(TELECOM);
  test.each(SCHEME_IDS)('%s: transformer volt-second balance over a period (derived: core volt-second balance)', (id) => {
    const w = waveforms(s, id);
    const onArea = Math.max(...w.secondaryV.map((p) => p.value)); // n·Vin during the on time after commutation
    const avg = average(w.secondaryV, w.periodS);
    // Arcs are drawn with 12 chords, whose trapezoids miss an arc's area by about h²/12 of it (h the chord's angle):
    // the resonant half sine (h = π/12) by 0.6 %, the drain ring's quarter cosine after a unipolar reset (h = π/24) by
    // 0.15 %; the active clamp is drawn with straight lines only.
    const chordError = id === 'resonant-reset' ? 0.01 : id === 'active-clamp' ? 1e-9 : 2e-3;
    expect(Math.abs(avg) / onArea).toBeLessThan(chordError);
    expect(w.drainV[w.drainV.length - 1]!.tS).toBeCloseTo(2 * w.periodS, 12);
  });
  test.each(SCHEME_IDS)('%s: the drain peak equals the off-state voltage at that input (derived)', (id) => {
    const w = waveforms(s, id, 75);
    const r = evaluateNormalised(s).results.find((x) => x.scheme === id)!;
    expect(Math.max(...w.drainV.map((p) => p.value))).toBeCloseTo(r.switchPeakV, 6);
  });
  test('inductor current averages to the load current (charge balance on C, derived)', () => {
    const w = waveforms(s, 'two-switch');
    expect(average(w.inductorA, w.periodS)).toBeCloseTo(TELECOM.ioutA, 9);
  });
  test('rejects an input outside the range', () => {
    expect(() => waveforms(s, 'two-switch', 80)).toThrow(/vinV \(80\) must lie between/);
  });
  test('sweepVin: duty = K/Vin falls across the range; two-switch voltage equals Vin (Hart §7.5 [M])', () => {
    const pts = sweepVin(s, 'two-switch', 5);
    expect(pts.map((p) => p.vinV)).toEqual([36, 45.75, 55.5, 65.25, 75]);
    for (const p of pts) expect(p.switchV).toBeCloseTo(p.vinV, 12);
    for (let k = 1; k < pts.length; k++) expect(pts[k]!.duty).toBeLessThan(pts[k - 1]!.duty);
    expect(() => sweepVin(s, 'two-switch', 1)).toThrow(RangeError);
  });
});
