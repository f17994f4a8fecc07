import type { NormalisedSpec, ScoreWeights } from '../../schemas/spec';

/**
 * Fixed-shape copy of a normalised spec for the pipeline. Callers build specs in many ways
 * (schema output, spreads, sweeps that vary one field), which gives the objects different hidden
 * classes; the pipeline reads the spec a few hundred times per scheme, so it reads this copy,
 * made once per call with every field in one order. Values are the caller's, unchanged.
 */
export function newSpecView(): NormalisedSpec {
  return {
    vinMinV: 0, vinNomV: 0, vinMaxV: 0, voutV: 0, ioutA: 0, fswHz: 0, schemes: [], rippleRatio: 0,
    voutRippleV: 0, ambientC: 0, annualVolume: 0, targetEfficiency: null, targetUnitCost: null,
    rectifier: 'diode', maxDuty: 0, voltageDerating: 0, leakageRatio: null, windingArrangement: 'non-interleaved',
    resetTurnsRatio: 0, activeClampVariant: 'high-side',
    weights: { stress: 0, dutyHeadroom: 0, partCount: 0, cost: 0, efficiency: 0 },
    overrides: {},
  };
}

/** Copy `spec` into the view `v` (field by field; `weights` into v's own record) and return `v`. */
export function copySpec(v: NormalisedSpec, spec: NormalisedSpec): NormalisedSpec {
  v.vinMinV = spec.vinMinV;
  v.vinNomV = spec.vinNomV;
  v.vinMaxV = spec.vinMaxV;
  v.voutV = spec.voutV;
  v.ioutA = spec.ioutA;
  v.fswHz = spec.fswHz;
  v.schemes = spec.schemes;
  v.rippleRatio = spec.rippleRatio;
  v.voutRippleV = spec.voutRippleV;
  v.ambientC = spec.ambientC;
  v.annualVolume = spec.annualVolume;
  v.targetEfficiency = spec.targetEfficiency;
  v.targetUnitCost = spec.targetUnitCost;
  v.rectifier = spec.rectifier;
  v.maxDuty = spec.maxDuty;
  v.voltageDerating = spec.voltageDerating;
  v.leakageRatio = spec.leakageRatio;
  v.windingArrangement = spec.windingArrangement;
  v.resetTurnsRatio = spec.resetTurnsRatio;
  v.activeClampVariant = spec.activeClampVariant;
  copyWeights(v.weights, spec.weights);
  v.overrides = spec.overrides;
  return v;
}

function copyWeights(to: ScoreWeights, from: ScoreWeights): void {
  to.stress = from.stress;
  to.dutyHeadroom = from.dutyHeadroom;
  to.partCount = from.partCount;
  to.cost = from.cost;
  to.efficiency = from.efficiency;
}
