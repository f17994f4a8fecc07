import { RAIL_CLAMP_OVERSHOOT } from '../assumptions';
import { chooseClampDiode, vfOf, withMargin } from './common';
import { unipolarOffShape } from './off-shape';
import type { ResetSchemeModel } from './types';
import { SCHEME_LABELS } from '../scheme-ids';

/**
 * Two-switch (double-ended) forward: each switch is clamped to the rail, Vds = Vin; reset through
 * the primary at −Vin gives Dmax = 0.5; magnetizing and leakage energy return to the input.
 * Sources: Hart §7.5 [M]; Pressman, Billings & Morey 3rd ed. ch. 2 [M]; Mohan, Undeland & Robbins ch. 10 [M].
 */
export const twoSwitch: ResetSchemeModel = {
  id: 'two-switch',
  label: SCHEME_LABELS['two-switch'],
  switchCount: 2,
  bipolarFlux: false,
  leakageClamped: true,
  seriesSwitches: 2,
  clampAllowance: RAIL_CLAMP_OVERSHOOT,
  diodeRole: 'clamp-diode',
  capacitorRole: 'clamp-capacitor',
  windingCount: 2,
  extraAmpereTurnsA: () => 0,
  restressAfterReset: false,
  formulas: {
    dutyLimit: 'Dlim = 0.5 − margin',
    offState: 'Vds = Vin on each switch (clamped by the diodes to the rails)',
    transient: 'Vds = Vin,max (clamped) + diode-recovery allowance',
    forwardReverse: 'VR(D1) = n·Vin',
    resetLoss: 'P = 2·VF·(Im,pk·D/2 + ½·Ip·tlk·fs), tlk = Llk·Ip/Vin',
    source: 'Hart §7.5 [M]; Pressman, Billings & Morey 3rd ed. ch. 2 [M]; Mohan, Undeland & Robbins ch. 10 [M]',
  },
  resetDutyLimit: () => 0.5,
  designDutyLimit: (spec) => withMargin(0.5, spec.maxDuty),
  transientDuty: (d) => d.dutyLimit,
  prepare() {},
  resetVoltageV: (_d, vinV) => vinV,
  offStateV: (_d, vinV) => vinV,
  transientV: (d) => d.spec.vinMaxV,
  turnOnV: (_d, vinV) => vinV / 2,
  sizeReset(d) {
    chooseClampDiode(d, d.spec.vinMaxV, d.magnetizingPeakA * d.dutyAtVinMin / 2 + 0.1 * d.primaryPeakA, 2);
    d.highSideDrivers = 1;
  },
  spikeLeakageH: () => 0,
  magnetizingOffsetA: () => 0,
  // Reset at −Vin through the clamp diodes: the flux falls in K/Vin of the period (derived: volt-seconds on Lm).
  fluxFallShare: (d, vinV) => Math.min(1, d.kV / vinV),
  // After the reset each drain rests at Vin/2: the two Co(er) share the input.
  offShape(d, vinV, tOffS, imEnd) {
    return unipolarOffShape(d, this, vinV, tOffS, imEnd, vinV / 2);
  },
  primaryOffA: (imA) => imA,
  ownFindings: () => [],
  resetWindingRatio: () => null,
  netlist: {
    // The high-side switch from the input to the primary's top (dt), the low-side one from the drain to ground.
    switchStage: { lines: ['S1 in dt g1 0 SWI', 'DB1 dt in DIDEAL', 'S1B d 0 g1 0 SWI', 'DB1B 0 d DIDEAL'], top: 'dt' },
    nodeCapacitance: (p, n, windingTop) => [
      "* Node capacitance: each switch's Co(er), and the winding capacitance across the primary",
      `CS1 in dt ${n(Math.max(p.switchCapacitanceF, 1e-12))}`, `CS2 d 0 ${n(Math.max(p.switchCapacitanceF, 1e-12))}`,
      `CW ${windingTop} d ${n(p.windingCapacitanceF)}`,
    ],
    resetNetwork: () => ['* Two-switch clamp diodes return the magnetizing energy to the input bus', 'DA d in DIDEAL', 'DB 0 dt DIDEAL'],
    magnetizingTerms: () => '',
    measuresCoreVoltage: false,
  },
  resetLossW(d, vinV, duty, primaryPeakA) {
    const tLeakS = (d.llkH * primaryPeakA) / vinV;
    return 2 * vfOf(d) * (d.magnetizingPeakA * duty / 2 + 0.5 * primaryPeakA * tLeakS * d.spec.fswHz);
  },
};
