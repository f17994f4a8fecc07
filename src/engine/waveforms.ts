import type { NormalisedSpec } from '../schemas/spec';
import { commutationDutyAt, rippleAtA, switchDutyAt } from './design/duty';
import { designScheme } from './design/pipeline';
import { magnetizingStartAt } from './design/stress';
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

/** Reset interval and shape of the drain voltage during the off time for one scheme (derived by volt-second balance on the magnetizing inductance). */
function offShape(d: Design, vinV: number, tOffS: number, imEnd: number): { tResetS: number; vReset: (x: number) => number; vAfter: number; imAt: (x: number) => number; vLmOff?: number } {
  const model = schemeModel(d.scheme);
  const im = imEnd;
  const swing = d.magnetizingSwingA;
  const kV = d.kV;
  const tS = 1 / d.spec.fswHz;
  switch (d.scheme) {
    case 'active-clamp':
      // Cc holds Vin·D/(1 − D) across Lm + Llk; Lm itself resets with K over the off time (the rest sits on Llk).
      return { tResetS: tOffS, vReset: () => model.offStateV(d, vinV), vAfter: model.offStateV(d, vinV), imAt: (x) => im - (swing * x) / tOffS, vLmOff: (kV * tS) / tOffS };
    case 'resonant-reset': {
      const half = Math.PI * Math.sqrt(d.lmH * d.resonantCF);
      const th = Math.min(half, tOffS);
      return { tResetS: th, vReset: (x) => vinV + d.resonantPeakV * Math.sin((Math.PI * x) / half), vAfter: vinV, imAt: (x) => (x >= th ? -im : im * Math.cos((Math.PI * x) / half)) };
    }
    default: {
      const vRes = model.resetVoltageV(d, vinV);
      const tr = Math.min((kV * tS) / vRes, tOffS);
      const vAfter = d.scheme === 'two-switch' ? vinV / 2 : vinV;
      return { tResetS: tr, vReset: () => model.offStateV(d, vinV), vAfter, imAt: (x) => (x >= tr ? 0 : im * (1 - x / tr)) };
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
    const steps = d.scheme === 'resonant-reset' ? ARC_SAMPLES : 1;
    for (let j = 0; j <= steps; j++) {
      const x = (shape.tResetS * j) / steps;
      const im = j === 0 ? imEnd : shape.imAt(x);
      const v = j === steps && d.scheme === 'resonant-reset' ? shape.vAfter : shape.vReset(x);
      sample(t0 + tOn + x, v, im, primaryOff(im), ilFalling(x), offSec);
    }
    if (shape.tResetS < tOff) {
      const imReset = shape.imAt(shape.tResetS);
      sample(t0 + tOn + shape.tResetS, shape.vAfter, imReset, primaryOff(imReset), ilFalling(shape.tResetS));
    }
    sample(t0 + tS, shape.vAfter, shape.imAt(tOff), primaryOff(shape.imAt(tOff)), ilFalling(tOff), offSec);
  }
  return w;
}

/** Waveforms of one scheme for a normalised spec at `vinV` (default the nominal input). */
export function waveforms(spec: NormalisedSpec, scheme: SchemeId, vinV?: number, library: PartsLibrary = demoPartsLibrary): Waveforms {
  const v = vinV ?? spec.vinNomV;
  if (!(v >= spec.vinMinV && v <= spec.vinMaxV)) throw new RangeError(`vinV (${v}) must lie between vinMinV (${spec.vinMinV}) and vinMaxV (${spec.vinMaxV})`);
  return waveformsOf(designScheme(spec, scheme, indexLibrary(library)), v);
}
