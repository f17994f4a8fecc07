import { ringCapacitanceF } from '../design/stress';
import type { Design } from '../design/types';
import type { OffShape, ResetSchemeModel } from './types';

/** Samples drawn along an arc of a resonance or a ring. */
export const ARC_SAMPLES = 12;

/** Push ARC_SAMPLES knots over (from, from + length]. */
export function arcKnots(from: number, length: number, out: number[]): void {
  for (let j = 1; j <= ARC_SAMPLES; j++) out.push(from + (length * j) / ARC_SAMPLES);
}

/**
 * Off time of a unipolar reset (tertiary winding, RCD clamp, two-switch; derived by volt-second balance on Lm): the
 * drain sits at the off-state voltage while the reset voltage Vr takes the magnetizing current from its end value down to
 * zero, then the node capacitance rings with Lm back to where the drain rests (`restV`), leaving −I0 in Lm
 * (design/stress.ts, ringCurrentA).
 */
export function unipolarOffShape(d: Design, model: ResetSchemeModel, vinV: number, tOffS: number, imEnd: number, restV: number): OffShape {
  const vOff = model.offStateV(d, vinV);
  const vr = model.resetVoltageV(d, vinV);
  const tr = Math.min((imEnd * d.lmH) / vr, tOffS);
  const c = ringCapacitanceF(d, model);
  const amplitude = c > 0 ? vr * Math.sqrt(c / d.lmH) : 0;
  const omega = c > 0 ? 1 / Math.sqrt(d.lmH * c) : Infinity;
  const tq = Math.min(Math.PI / (2 * omega), tOffS - tr);
  const knots = [0, tr];
  if (tq > 0) arcKnots(tr, tq, knots);
  if (tr + tq < tOffS) knots.push(tOffS);
  const phase = (x: number): number => Math.min(omega * (x - tr), Math.PI / 2);
  return {
    knots,
    v: (x) => (x <= tr ? vOff : restV + (vOff - restV) * Math.cos(phase(x))),
    im: (x) => (x <= tr ? imEnd * (1 - x / tr) : -amplitude * Math.sin(phase(x))),
  };
}
