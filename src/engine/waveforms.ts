import type { NormalisedSpec } from '../schemas/spec';
import { commutationDutyAt, rippleAtA, switchDutyAt } from './design/duty';
import { designScheme } from './design/pipeline';
import { magnetizingStartAt, ringCapacitanceF } from './design/stress';
import type { Design } from './design/types';
import { indexLibrary } from './parts/index-library';
import { demoPartsLibrary } from './parts/demo-library';
import type { PartsLibrary } from './parts/types';
import { schemeModel } from './registry';
import type { SchemeId } from './scheme-ids';

/** One sample of a waveform trace. */
export interface WavePoint {
  tS: number;
  value: number;
}

/** Idealised waveforms over two switching periods (piecewise-linear corners; resonant arcs sampled). */
export interface Waveforms {
  scheme: SchemeId;
  vinV: number;
  periodS: number;
  drainV: WavePoint[];
  primaryA: WavePoint[];
  magnetizingA: WavePoint[];
  secondaryV: WavePoint[];
  inductorA: WavePoint[];
}

const ARC_SAMPLES = 12;

/**
 * Drain voltage and magnetizing current over the off time of one scheme, and the times to sample them at (derived by
 * volt-second balance on the magnetizing inductance). `knots` run from 0 to tOff; a corner of the drawing sits on one.
 */
interface OffShape {
  knots: number[];
  v: (x: number) => number;
  im: (x: number) => number;
  /** Voltage across Lm during the off time when the secondary sees it (active clamp), else undefined. */
  vLmOff?: number;
}

function arcKnots(from: number, length: number, out: number[]): void {
  for (let j = 1; j <= ARC_SAMPLES; j++) out.push(from + (length * j) / ARC_SAMPLES);
}

function offShape(d: Design, vinV: number, tOffS: number, imEnd: number): OffShape {
  const model = schemeModel(d.scheme);
  const swing = d.magnetizingSwingA;
  const kV = d.kV;
  const tS = 1 / d.spec.fswHz;
  switch (d.scheme) {
    case 'active-clamp': {
      // Cc holds Vin·D/(1 − D) across Lm + Llk; Lm itself resets with K over the off time (the rest sits on Llk).
      const vOff = model.offStateV(d, vinV);
      return { knots: [0, tOffS], v: () => vOff, im: (x) => imEnd - (swing * x) / tOffS, vLmOff: (kV * tS) / tOffS };
    }
    case 'resonant-reset': {
      // The tank starts where the leakage left it (Cr above Vin, current I2 = imEnd) and swings with peak current
      // I1 = ΔIm − I2 (schemes/resonant-reset.ts): v = Vin + Z0·I1·sin(ωx + φ0), im = I1·cos(ωx + φ0), cos φ0 = I2/I1,
      // until the drain is back at Vin and the current at −I1.
      const omega = 1 / Math.sqrt(d.lmH * d.resonantCF);
      const i1 = swing - imEnd;
      const vPk = model.resetVoltageV(d, vinV);
      const phi0 = Math.acos(Math.max(-1, Math.min(1, imEnd / i1)));
      const th = Math.min((Math.PI - phi0) / omega, tOffS);
      const knots = [0];
      arcKnots(0, th, knots);
      // The drawn peak is the real one: a knot where the sine tops out.
      const xPeak = (Math.PI / 2 - phi0) / omega;
      if (xPeak > 0 && xPeak < th) knots.splice(knots.findIndex((x) => x > xPeak), 0, xPeak);
      if (th < tOffS) knots.push(tOffS);
      return {
        knots,
        v: (x) => (x >= th ? vinV : vinV + vPk * Math.sin(omega * x + phi0)),
        im: (x) => (x >= th ? -i1 : i1 * Math.cos(omega * x + phi0)),
      };
    }
    default: {
      // Reset at the scheme's voltage until the current reaches zero, then the drain rings with Lm back to where it
      // rests (Vin; Vin/2 per switch in the two-switch forward), leaving −I0 in Lm (design/stress.ts, ringCurrentA).
      const vOff = model.offStateV(d, vinV);
      const vAfter = d.scheme === 'two-switch' ? vinV / 2 : vinV;
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
        v: (x) => (x <= tr ? vOff : vAfter + (vOff - vAfter) * Math.cos(phase(x))),
        im: (x) => (x <= tr ? imEnd * (1 - x / tr) : -amplitude * Math.sin(phase(x))),
      };
    }
  }
}

/**
 * Idealised waveforms of a design at an input voltage, two periods. Each period opens with the
 * leakage commutation (design/duty.ts): the switch is on, the primary current climbs to the
 * reflected load, the secondary is shorted and the magnetizing current and the inductor current
 * do not yet rise; for the rest of the on time Lm (and, reflected, the secondary) sees the input
 * less the drop across Llk.
 */
export function waveformsOf(d: Design, vinV: number = d.spec.vinNomV): Waveforms {
  const s = d.spec;
  const tS = 1 / s.fswHz;
  const duty = switchDutyAt(d, vinV);
  const tOn = duty * tS;
  const tOff = tS - tOn;
  const tc = commutationDutyAt(d, vinV) * tS;
  const ripple = rippleAtA(d, vinV);
  // Lm's voltage over the rest of the on time: the volt-seconds K spread over tOn − tc.
  const vLm = (d.kV * tS) / (tOn - tc);
  const n = d.turnsRatio;
  const series = schemeModel(d.scheme).seriesSwitches;
  const im0 = magnetizingStartAt(d, schemeModel(d.scheme), vinV);
  const imEnd = im0 + d.magnetizingSwingA;
  const shape = offShape(d, vinV, tOff, imEnd);
  const w: Waveforms = { scheme: d.scheme, vinV, periodS: tS, drainV: [], primaryA: [], magnetizingA: [], secondaryV: [], inductorA: [] };
  // Secondary voltage: given during the on time (0 while shorted, n·V(Lm) after), else reflected from the drain.
  const sample = (t: number, vds: number, im: number, ip: number, il: number, vSec?: number): void => {
    w.drainV.push({ tS: t, value: vds });
    w.magnetizingA.push({ tS: t, value: im });
    w.primaryA.push({ tS: t, value: ip });
    w.secondaryV.push({ tS: t, value: vSec ?? n * (vinV - series * vds) });
    w.inductorA.push({ tS: t, value: il });
  };
  const ilMin = s.ioutA - ripple / 2;
  const ilMax = s.ioutA + ripple / 2;
  // The inductor current falls from the end of the on time until commutation ends in the next period.
  const ilFalling = (x: number): number => ilMax - ((ilMax - ilMin) * x) / (tOff + tc);
  const primaryOff = (im: number): number => (d.scheme === 'tertiary-winding' ? 0 : im);
  const offSec = shape.vLmOff === undefined ? undefined : -n * shape.vLmOff;
  for (let k = 0; k < 2; k++) {
    const t0 = k * tS;
    sample(t0, 0, im0, im0, ilFalling(tOff), 0);
    sample(t0 + tc, 0, im0, n * ilMin + im0, ilMin, 0);
    sample(t0 + tc, 0, im0, n * ilMin + im0, ilMin, n * vLm);
    sample(t0 + tOn, 0, imEnd, n * ilMax + imEnd, ilMax, n * vLm);
    for (const x of shape.knots) {
      const im = x === 0 ? imEnd : shape.im(x);
      sample(t0 + tOn + x, shape.v(x), im, primaryOff(im), ilFalling(x), shape.vLmOff === undefined ? undefined : offSec);
    }
  }
  return w;
}

/** Waveforms of one scheme for a normalised spec at `vinV` (default the nominal input). */
export function waveforms(spec: NormalisedSpec, scheme: SchemeId, vinV?: number, library: PartsLibrary = demoPartsLibrary): Waveforms {
  const v = vinV ?? spec.vinNomV;
  if (!(v >= spec.vinMinV && v <= spec.vinMaxV)) throw new RangeError(`vinV (${v}) must lie between vinMinV (${spec.vinMinV}) and vinMaxV (${spec.vinMaxV})`);
  return waveformsOf(designScheme(spec, scheme, indexLibrary(library)), v);
}
