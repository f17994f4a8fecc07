import type { NormalisedSpec } from '../schemas/spec';
import { switchDutyAt } from './design/duty';
import { designScheme } from './design/pipeline';
import { indexLibrary } from './parts/index-library';
import { demoPartsLibrary } from './parts/demo-library';
import type { PartsLibrary } from './parts/types';
import { schemeModel } from './registry';
import type { SchemeId } from './scheme-ids';

/** One point of the line sweep: duty and steady off-state switch voltage at an input voltage. */
export interface VinSweepPoint {
  vinV: number;
  duty: number;
  switchV: number;
  rectifierForwardV: number;
}

/**
 * Switch duty (K/Vin plus the leakage share, design/duty.ts) and steady switch voltage across the input range for the charts
 * (`points` evenly spaced from vinMinV to vinMaxV, at least 2). Formulas per scheme (derived by volt-second balance).
 */
export function sweepVin(spec: NormalisedSpec, scheme: SchemeId, points = 41, library: PartsLibrary = demoPartsLibrary): VinSweepPoint[] {
  if (!Number.isInteger(points) || points < 2 || points > 10000) throw new RangeError(`points must be an integer from 2 to 10000, got ${points}`);
  const d = designScheme(spec, scheme, indexLibrary(library));
  const model = schemeModel(scheme);
  const out: VinSweepPoint[] = [];
  for (let k = 0; k < points; k++) {
    const vinV = spec.vinMinV + ((spec.vinMaxV - spec.vinMinV) * k) / (points - 1);
    out.push({ vinV, duty: switchDutyAt(d, vinV), switchV: model.offStateV(d, vinV), rectifierForwardV: d.turnsRatio * model.resetVoltageV(d, vinV) });
  }
  return out;
}
