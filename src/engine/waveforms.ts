import type { NormalisedSpec } from '../schemas/spec';
import { designScheme } from './design/pipeline';
import type { Design } from './design/types';
import { inductorRippleA } from './filter';
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
function offShape(d: Design, vinV: number, tOffS: number): { tResetS: number; vReset: (x: number) => number; vAfter: number; imAt: (x: number) => number } {
  const model = schemeModel(d.scheme);
  const im = d.magnetizingPeakA;
  const kV = d.kV;
  const tS = 1 / d.spec.fswHz;
  switch (d.scheme) {
    case 'active-clamp':
      return { tResetS: tOffS, vReset: () => model.offStateV(d, vinV), vAfter: model.offStateV(d, vinV), imAt: (x) => im - (2 * im * x) / tOffS };
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

/** Idealised waveforms of a design at an input voltage, two periods. */
export function waveformsOf(d: Design, vinV: number = d.spec.vinNomV): Waveforms {
  const s = d.spec;
  const tS = 1 / s.fswHz;
  const duty = d.kV / vinV;
  const tOn = duty * tS;
  const tOff = tS - tOn;
  const ripple = inductorRippleA(s.voutV + d.dropsV, duty, d.outputInductanceH, s.fswHz);
  const n = d.turnsRatio;
  const series = schemeModel(d.scheme).seriesSwitches;
  const bipolar = d.scheme === 'active-clamp' || d.scheme === 'resonant-reset';
  const im0 = bipolar ? -d.magnetizingPeakA : 0;
  const shape = offShape(d, vinV, tOff);
  const w: Waveforms = { scheme: d.scheme, vinV, periodS: tS, drainV: [], primaryA: [], magnetizingA: [], secondaryV: [], inductorA: [] };
  const sample = (t: number, vds: number, im: number, ip: number, il: number): void => {
    w.drainV.push({ tS: t, value: vds });
    w.magnetizingA.push({ tS: t, value: im });
    w.primaryA.push({ tS: t, value: ip });
    w.secondaryV.push({ tS: t, value: n * (vinV - series * vds) });
    w.inductorA.push({ tS: t, value: il });
  };
  const ilMin = s.ioutA - ripple / 2;
  const ilMax = s.ioutA + ripple / 2;
  const primaryOff = (im: number): number => (d.scheme === 'tertiary-winding' ? 0 : im);
  for (let k = 0; k < 2; k++) {
    const t0 = k * tS;
    sample(t0, 0, im0, n * ilMin + im0, ilMin);
    sample(t0 + tOn, 0, d.magnetizingPeakA, n * ilMax + d.magnetizingPeakA, ilMax);
    const steps = d.scheme === 'resonant-reset' ? ARC_SAMPLES : 1;
    for (let j = 0; j <= steps; j++) {
      const x = (shape.tResetS * j) / steps;
      const im = j === 0 ? d.magnetizingPeakA : shape.imAt(x);
      const v = j === steps && d.scheme === 'resonant-reset' ? shape.vAfter : shape.vReset(x);
      sample(t0 + tOn + x, v, im, primaryOff(im), ilMax - ((ilMax - ilMin) * x) / tOff);
    }
    if (shape.tResetS < tOff) {
      const imEnd = shape.imAt(shape.tResetS);
      const ilAt = ilMax - ((ilMax - ilMin) * shape.tResetS) / tOff;
      sample(t0 + tOn + shape.tResetS, shape.vAfter, imEnd, primaryOff(imEnd), ilAt);
    }
    sample(t0 + tS, shape.vAfter, shape.imAt(tOff), primaryOff(shape.imAt(tOff)), ilMin);
  }
  return w;
}

/** Waveforms of one scheme for a normalised spec at `vinV` (default the nominal input). */
export function waveforms(spec: NormalisedSpec, scheme: SchemeId, vinV?: number, library: PartsLibrary = demoPartsLibrary): Waveforms {
  const v = vinV ?? spec.vinNomV;
  if (!(v >= spec.vinMinV && v <= spec.vinMaxV)) throw new RangeError(`vinV (${v}) must lie between vinMinV (${spec.vinMinV}) and vinMaxV (${spec.vinMaxV})`);
  return waveformsOf(designScheme(spec, scheme, indexLibrary(library)), v);
}
