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

/** Idealised waveforms over two switching periods (piecewise-linear corners; resonant arcs sampled; shapes from each scheme's model). */
export interface Waveforms {
  scheme: SchemeId;
  /** Main switches in series (the two-switch forward's 2): `drainV` is then the voltage across each of them. */
  seriesSwitches: number;
  vinV: number;
  periodS: number;
  drainV: WavePoint[];
  primaryA: WavePoint[];
  magnetizingA: WavePoint[];
  secondaryV: WavePoint[];
  inductorA: WavePoint[];
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
  const model = schemeModel(d.scheme);
  const series = model.seriesSwitches;
  const im0 = magnetizingStartAt(d, model, vinV);
  const imEnd = im0 + d.magnetizingSwingA;
  const shape = model.offShape(d, vinV, tOff, imEnd);
  const w: Waveforms = { scheme: d.scheme, seriesSwitches: series, vinV, periodS: tS, drainV: [], primaryA: [], magnetizingA: [], secondaryV: [], inductorA: [] };
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
  const offSec = shape.vLmOff === undefined ? undefined : -n * shape.vLmOff;
  for (let k = 0; k < 2; k++) {
    const t0 = k * tS;
    sample(t0, 0, im0, im0, ilFalling(tOff), 0);
    sample(t0 + tc, 0, im0, n * ilMin + im0, ilMin, 0);
    sample(t0 + tc, 0, im0, n * ilMin + im0, ilMin, n * vLm);
    sample(t0 + tOn, 0, imEnd, n * ilMax + imEnd, ilMax, n * vLm);
    for (const x of shape.knots) {
      const im = x === 0 ? imEnd : shape.im(x);
      sample(t0 + tOn + x, shape.v(x), im, model.primaryOffA(im), ilFalling(x), shape.vLmOff === undefined ? undefined : offSec);
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
