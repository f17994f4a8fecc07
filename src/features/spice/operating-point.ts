import { WINDING_CAPACITANCE_F, WINDING_DROP_SHARE } from '../../engine/assumptions';
import { waveforms, type NormalisedSpec, type PartsLibrary, type SchemeResult } from '../../engine';
import type { NetlistPoint, VinCase } from '../../engine/schemes/netlist-types';

export type { NetlistPoint, VinCase } from '../../engine/schemes/netlist-types';
export { VIN_CASES } from '../../engine/schemes/netlist-types';

/** Input voltage of a case. */
export function vinOf(spec: NormalisedSpec, vinCase: VinCase): number {
  return vinCase === 'min' ? spec.vinMinV : vinCase === 'max' ? spec.vinMaxV : spec.vinNomV;
}

/**
 * Collects the operating point of one scheme result. The expected switch peak and inductor ripple
 * come from the engine's idealised waveforms at this input (no leakage spike).
 * Throws RangeError when the result has no usable design (e.g. no core fits).
 */
export function netlistPoint(spec: NormalisedSpec, result: SchemeResult, vinCase: VinCase, library: PartsLibrary): NetlistPoint {
  const vinV = vinOf(spec, vinCase);
  const d = result.details;
  if (!(d.magnetizingInductanceH > 0) || !(result.turnsRatio > 0) || !(result.outputInductanceH > 0) || !(result.outputCapacitanceF > 0)) {
    throw new RangeError(`${result.label}: the engine found no complete design for this requirement set, so there is no netlist to draw`);
  }
  const duty = vinCase === 'min' ? result.duty.atVinMin : vinCase === 'max' ? result.duty.atVinMax : result.duty.atVinNom;
  if (!(duty > 0 && duty < 1)) throw new RangeError(`${result.label}: duty at ${vinV} V would be ${duty.toFixed(3)}, outside (0, 1)`);
  const windingDropV = WINDING_DROP_SHARE * spec.voutV;
  const w = waveforms(spec, result.scheme, vinV, library);
  const il = w.inductorA.map((p) => p.value);
  const switchPeakV = Math.max(...w.drainV.map((p) => p.value));
  const sw = d.mainSwitchId ? library.mosfets.find((m) => m.id === d.mainSwitchId) : undefined;
  return {
    scheme: result.scheme, label: result.label, vinCase, vinV, voutV: spec.voutV, ioutA: spec.ioutA, fswHz: spec.fswHz,
    duty, turnsRatio: result.turnsRatio, resetTurnsRatio: result.resetTurnsRatio, lmH: d.magnetizingInductanceH, llkH: d.leakageInductanceH,
    rectifierDropV: d.dropsV - windingDropV, windingDropV,
    outputInductanceH: result.outputInductanceH, outputCapacitanceF: result.outputCapacitanceF,
    clampCapacitorV: result.clampCapacitorV, clampResistorOhm: d.clampResistorOhm, clampCapacitanceF: d.clampCapacitanceF,
    resonantCapacitanceF: d.resonantCapacitanceF, activeClampVariant: spec.activeClampVariant,
    magnetizingPeakA: result.magnetizingPeakA, magnetizingStartA: w.magnetizingA[0]!.value,
    switchCapacitanceF: sw ? sw.cossF * d.mainSwitchParallel : 0, windingCapacitanceF: WINDING_CAPACITANCE_F,
    expected: {
      switchPeakV, switchStressV: result.switchStressV, voutV: spec.voutV, inductorRippleA: Math.max(...il) - Math.min(...il),
      magnetizingPeakA: Math.max(...w.magnetizingA.map((p) => Math.abs(p.value))),
    },
  };
}
