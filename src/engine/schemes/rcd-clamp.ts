import { RCD_CLAMP_MARGIN, RCD_DESIGN_DUTY } from '../assumptions';
import { E24, E6, snapDownIn, snapUpIn } from '../eseries';
import { selectResistor } from '../parts/select';
import { switchDutyAt } from '../design/duty';
import { setRectifierVoltages } from '../design/converter';
import { magnetizingStartAt, peakOffStateV, ringCapacitanceF, settleMagnetizing } from '../design/stress';
import { chooseClampCap, chooseClampDiode, vfOf } from './common';
import { drainCapacitance, GROUNDED_SWITCH } from './netlist-common';
import { unipolarOffShape } from './off-shape';
import type { ResetSchemeModel } from './types';
import { SCHEME_LABELS } from '../scheme-ids';

/** RCD clamp voltage needed at the design duty, with the 20 % margin, per volt of Vin,min: Vcl/Vin,min = 1.2·Dlim/(1 − Dlim) (derived by volt-second balance). */
function clampRatio(dutyLimit: number): number {
  return (RCD_CLAMP_MARGIN * dutyLimit) / (1 - dutyLimit);
}

/**
 * Clamp dissipation P_R = fs·(½·Lm·Im,off² + ½·Llk·Ip,pk² − ½·C·Vcl²) (derived by energy balance): at turn-off the
 * leakage, carrying the primary peak, first lifts the drain node C from Vin to Vin + Vcl while the commutating
 * secondary holds Lm at 0 V — with the input in the loop, that costs the leakage ½·C·Vcl², which the node gives back to
 * Lm as the ring after the reset — then the rest of the leakage energy and all of the magnetizing energy (Im,off the
 * magnetizing current at turn-off) go into the clamp. With C = 0 it is the textbook fs·(½·Lm·Im² + ½·Llk·Ip²).
 */
export function rcdClampLossW(lmH: number, imOffA: number, llkH: number, ipPkA: number, nodeCapF: number, clampV: number, fswHz: number): number {
  return fswHz * (0.5 * lmH * imOffA * imOffA + Math.max(0, 0.5 * llkH * ipPkA * ipPkA - 0.5 * nodeCapF * clampV * clampV));
}

/** Most fixed-point steps for the clamp voltage a snapped resistor settles at (Vcl moves P only through the ring terms, weakly: 2–5 steps reach 1e-8). */
const CLAMP_SETTLE_STEPS = 12;

/**
 * Single-switch forward with an RCD clamp across the primary: Vds = Vin + Vcl; reset needs
 * Vcl ≥ Vin·D/(1 − D); magnetizing and leakage energy are dissipated in R (derived; common practice).
 */
export const rcdClamp: ResetSchemeModel = {
  id: 'rcd-clamp',
  label: SCHEME_LABELS['rcd-clamp'],
  switchCount: 1,
  bipolarFlux: false,
  leakageClamped: true,
  seriesSwitches: 1,
  clampAllowance: 0,
  diodeRole: 'clamp-diode',
  capacitorRole: 'clamp-capacitor',
  windingCount: 2,
  extraAmpereTurnsA: () => 0,
  restressAfterReset: false,
  formulas: {
    dutyLimit: 'Dlim = min(maxDuty, 0.5); reset limit Vcl/(Vin,min + Vcl)',
    offState: 'Vds = Vin + Vcl, Vcl = 1.2·Vin,min·D/(1 − D) with the switch duty D (leakage commutation included) at Dlim',
    transient: 'Vds → Vin,max/(1 − Dlim) when D reaches its limit at high line',
    forwardReverse: 'VR(D1) = n·Vcl',
    resetLoss: 'P_R = fs·(½·Lm·Im,off² + ½·Llk·Ip,pk² − ½·C·Vcl²), C the drain node; Vcl = √(P_R·R) with R snapped down to E24',
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
    const fs = d.spec.fswHz;
    const cNode = ringCapacitanceF(d, this);
    let p = rcdClampLossW(d.lmH, d.magnetizingPeakA, d.llkH, d.primaryPeakA, cNode, d.clampV, fs);
    d.clampResOhm = snapDownIn((d.clampV * d.clampV) / p, E24);
    // The E24 resistor, snapped down, holds the clamp a little below its design value: Vcl = √(P·R), where P (the ring
    // terms) and the ring itself move with Vcl (derived). The switch was chosen for the design value; the figures that
    // follow Vcl (peak, stress, D1's reverse voltage) are set again from the value the clamp settles at.
    for (let k = 0; k < CLAMP_SETTLE_STEPS; k++) {
      const v = Math.sqrt(p * d.clampResOhm);
      const moved = Math.abs(v - d.clampV);
      d.clampV = v;
      settleMagnetizing(d, this);
      p = rcdClampLossW(d.lmH, d.magnetizingPeakA, d.llkH, d.primaryPeakA, cNode, d.clampV, fs);
      if (moved <= 1e-8 * v) break;
    }
    d.switchPeakV = peakOffStateV(d, this);
    d.transientV = Math.max(this.transientV(d), d.switchPeakV);
    d.switchStressV = d.transientV;
    setRectifierVoltages(d, this);
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
  offShape(d, vinV, tOffS, imEnd) {
    return unipolarOffShape(d, this, vinV, tOffS, imEnd, vinV);
  },
  primaryOffA: (imA) => imA,
  ownFindings: () => [],
  resetWindingRatio: () => null,
  netlist: {
    switchStage: GROUNDED_SWITCH,
    nodeCapacitance: drainCapacitance,
    resetNetwork: (p, n) => [
      `* RCD clamp across the primary; clamp voltage ${n(p.clampCapacitorV ?? 0)} V above the input`,
      'DCL d cl DIDEAL',
      `CCL cl in ${n(p.clampCapacitanceF ?? 1e-6)} IC=${n(p.clampCapacitorV ?? 0)}`,
      `RCL cl in ${n(p.clampResistorOhm ?? 1e6)}`,
    ],
    magnetizingTerms: () => '',
    measuresCoreVoltage: true,
  },
  resetLossW(d, vinV, _duty, primaryPeakA) {
    const imOff = d.magnetizingSwingA + magnetizingStartAt(d, this, vinV);
    const p = rcdClampLossW(d.lmH, imOff, d.llkH, primaryPeakA, ringCapacitanceF(d, this), d.clampV, d.spec.fswHz);
    return p + vfOf(d) * p / d.clampV;
  },
};
