import { RCD_CLAMP_MARGIN, RCD_DESIGN_DUTY } from '../assumptions';
import { E24, E6, snapDownIn, snapUpIn } from '../eseries';
import { selectResistor } from '../parts/select';
import { switchDutyAt } from '../design/duty';
import { chooseClampCap, chooseClampDiode, vfOf } from './common';
import type { ResetSchemeModel } from './types';

/** RCD clamp voltage needed at the design duty, with the 20 % margin, per volt of Vin,min: Vcl/Vin,min = 1.2·Dlim/(1 − Dlim) (derived by volt-second balance). */
function clampRatio(dutyLimit: number): number {
  return (RCD_CLAMP_MARGIN * dutyLimit) / (1 - dutyLimit);
}

/** Clamp dissipation P_R = fs·(½·Lm·Im,pk² + ½·Llk·Ip,pk²) (derived by energy balance). */
export function rcdClampLossW(lmH: number, imPkA: number, llkH: number, ipPkA: number, fswHz: number): number {
  return fswHz * (0.5 * lmH * imPkA * imPkA + 0.5 * llkH * ipPkA * ipPkA);
}

/**
 * Single-switch forward with an RCD clamp across the primary: Vds = Vin + Vcl; reset needs
 * Vcl ≥ Vin·D/(1 − D); magnetizing and leakage energy are dissipated in R (derived; common practice).
 */
export const rcdClamp: ResetSchemeModel = {
  id: 'rcd-clamp',
  label: 'RCD clamp',
  switchCount: 1,
  bipolarFlux: false,
  leakageClamped: true,
  seriesSwitches: 1,
  clampAllowance: 0,
  diodeRole: 'clamp-diode',
  capacitorRole: 'clamp-capacitor',
  restressAfterReset: false,
  formulas: {
    dutyLimit: 'Dlim = min(maxDuty, 0.5); reset limit Vcl/(Vin,min + Vcl)',
    offState: 'Vds = Vin + Vcl, Vcl = 1.2·Vin,min·D/(1 − D) with the switch duty D (leakage commutation included) at Dlim',
    transient: 'Vds → Vin,max/(1 − Dlim) when D reaches its limit at high line',
    forwardReverse: 'VR(D1) = n·Vcl',
    resetLoss: 'P_R = fs·(½·Lm·Im,pk² + ½·Llk·Ip,pk²)',
    source: 'derived (volt-second and energy balance); common practice',
  },
  resetDutyLimit(spec) {
    const x = clampRatio(Math.min(spec.maxDuty, RCD_DESIGN_DUTY));
    return x / (1 + x);
  },
  designDutyLimit: (spec) => Math.min(spec.maxDuty, RCD_DESIGN_DUTY),
  transientDuty: (d) => d.dutyLimit,
  prepare(d) {
    // Reset needs Vcl·(1 − D) ≥ Vin·D with the switch duty D, leakage commutation included: while the leakage hands the
    // load current back at turn-off the secondary is shorted and Lm gets no reset voltage, so the clamp must return
    // K + Llk·fs·n·IL in the rest of the off time (derived: volt-seconds on Lm). The turns ratio puts that duty at the
    // limit at Vin,min; an overridden ratio uses its own switch duty there.
    const dt = d.ov?.turnsRatio ? Math.min(switchDutyAt(d, d.spec.vinMinV), d.dutyLimit) : d.dutyLimit;
    d.clampV = (RCD_CLAMP_MARGIN * d.spec.vinMinV * dt) / (1 - d.dutyLimit);
  },
  resetVoltageV: (d) => d.clampV,
  offStateV: (d, vinV) => vinV + d.clampV,
  transientV: (d) => d.spec.vinMaxV / (1 - d.transientDuty),
  turnOnV: (_d, vinV) => vinV,
  sizeReset(d) {
    const p = rcdClampLossW(d.lmH, d.magnetizingPeakA, d.llkH, d.primaryPeakA, d.spec.fswHz);
    d.clampResOhm = snapDownIn((d.clampV * d.clampV) / p, E24);
    const r = selectResistor(d.index.resistors, p, d.clampV);
    if (r >= 0) { d.clampRes = d.index.resistors[r]!; d.clampResPrice = d.prices.resistors[r]!; } else d.fails.push('no-clamp-part');
    // C ≥ Vcl/(R·fs·ΔVcl) with ΔVcl = 10 % of Vcl (derived; ripple share common practice).
    d.clampCapF = snapUpIn(1 / (d.clampResOhm * d.spec.fswHz * 0.1), E6);
    chooseClampCap(d, d.clampCapF, d.clampV);
    chooseClampDiode(d, d.spec.vinMaxV + d.clampV, p / d.clampV, 1);
    d.lowSideDrivers = 1;
  },
  spikeLeakageH: () => 0,
  magnetizingOffsetA: () => 0,
  // Reset at −Vcl: the flux falls in K/Vcl of the period (derived: volt-seconds on Lm).
  fluxFallShare: (d) => Math.min(1, d.kV / d.clampV),
  resetLossW(d, _vinV, _duty, primaryPeakA) {
    const p = rcdClampLossW(d.lmH, d.magnetizingPeakA, d.llkH, primaryPeakA, d.spec.fswHz);
    return p + vfOf(d) * p / d.clampV;
  },
};
