import { BIFILAR_LEAKAGE_SHARE } from '../assumptions';
import { chooseClampDiode, vfOf, withMargin } from './common';
import { drainCapacitance, GROUNDED_SWITCH } from './netlist-common';
import { unipolarOffShape } from './off-shape';
import type { ResetSchemeModel } from './types';
import { SCHEME_LABELS } from '../scheme-ids';

/**
 * Single-switch forward with a tertiary (reset) winding, Nr/Np = r.
 * Dmax = 1/(1 + Nr/Np); Vds = Vin·(1 + Np/Nr) (2·Vin for 1:1), plus an unclamped leakage spike.
 * Sources: Erickson & Maksimović 2nd ed. §6.3.4 [M]; Mohan, Undeland & Robbins ch. 10 [M]; Hart §7.4 [M].
 */
export const tertiaryWinding: ResetSchemeModel = {
  id: 'tertiary-winding',
  label: SCHEME_LABELS['tertiary-winding'],
  switchCount: 1,
  bipolarFlux: false,
  leakageClamped: false,
  seriesSwitches: 1,
  clampAllowance: 0,
  diodeRole: 'reset-diode',
  capacitorRole: 'clamp-capacitor',
  windingCount: 3,
  // The reset winding (Nr = r·Np) carries Lm's current reflected, Im,pk·Np/Nr falling to zero over the reset time t_r:
  // Nr·I_rms = Np·Im,pk·√(t_r·fs/3), at Vin,min where the reset is longest (derived; FORMULAS §1.1 reset-winding rms).
  extraAmpereTurnsA: (d) => d.turnsPrimary * d.magnetizingPeakA * Math.sqrt(Math.min(1, (d.kV * d.resetTurnsRatio) / d.spec.vinMinV) / 3),
  restressAfterReset: false,
  formulas: {
    dutyLimit: 'Dlim = 1/(1 + Nr/Np) − margin',
    offState: 'Vds = Vin·(1 + Np/Nr)',
    transient: 'Vds = Vin,max·(1 + Np/Nr) (independent of D; D must be hard-limited)',
    forwardReverse: 'VR(D1) = n·Vin·Np/Nr',
    resetLoss: 'P = VF·Im,pk·D/2 + ½·Llk,pr·Ip²·fs (reset diode + the primary–reset leakage energy in the snubber; Llk,pr = 10 % of Llk, bifilar)',
    source: 'Erickson & Maksimović 2nd ed. §6.3.4 [M]; Mohan, Undeland & Robbins ch. 10 [M]; Hart §7.4 [M]',
  },
  resetDutyLimit: (spec) => 1 / (1 + spec.resetTurnsRatio),
  designDutyLimit: (spec) => withMargin(1 / (1 + spec.resetTurnsRatio), spec.maxDuty),
  transientDuty: (d) => d.dutyLimit,
  prepare(d) {
    d.resetTurnsRatio = d.spec.resetTurnsRatio;
  },
  resetVoltageV: (d, vinV) => vinV / d.resetTurnsRatio,
  offStateV: (d, vinV) => vinV * (1 + 1 / d.resetTurnsRatio),
  transientV: (d) => d.spec.vinMaxV * (1 + 1 / d.resetTurnsRatio),
  turnOnV: (_d, vinV) => vinV,
  sizeReset(d) {
    // Reset diode blocks Vin·(1 + Nr/Np) while the switch is on (derived).
    chooseClampDiode(d, d.spec.vinMaxV * (1 + d.resetTurnsRatio), d.magnetizingPeakA * d.dutyAtVinMin / 2, 1);
    d.lowSideDrivers = 1;
  },
  // The reset winding, bifilar with the primary, clamps it at turn-off and returns the primary–secondary leakage energy
  // to the input; only the leakage between primary and reset winding rings into the drain (BIFILAR_LEAKAGE_SHARE).
  spikeLeakageH: (d) => BIFILAR_LEAKAGE_SHARE * d.llkH,
  magnetizingOffsetA: () => 0,
  // The reset winding puts Vin/r on Lm (r = Nr/Np), so the flux falls in K·r/Vin of the period (derived: volt-seconds on Lm).
  fluxFallShare: (d, vinV) => Math.min(1, (d.kV * d.resetTurnsRatio) / vinV),
  offShape(d, vinV, tOffS, imEnd) {
    return unipolarOffShape(d, this, vinV, tOffS, imEnd, vinV);
  },
  // The reset winding, not the primary, carries the magnetizing current back to the input.
  primaryOffA: () => 0,
  // Wound bifilar with the primary, the reset winding sits next to it at Vin·(1 + Nr/Np) (100 V: where insulation
  // between adjacent turns starts to need care; common practice).
  ownFindings: (d) => (d.spec.vinMaxV > 100
    ? [{ severity: 'info', code: 'bifilar-insulation', message: `a bifilar primary/reset winding sees ${(d.spec.vinMaxV * (1 + 1 / d.spec.resetTurnsRatio)).toFixed(1)} V between adjacent turns; check insulation` }]
    : []),
  resetWindingRatio: (d) => d.resetTurnsRatio,
  netlist: {
    switchStage: GROUNDED_SWITCH,
    nodeCapacitance: drainCapacitance,
    // Bifilar with the primary, the reset winding links the primary's leakage flux too: its own leakage r²·Llk, coupled
    // to the primary's, takes the leakage current over at turn-off and returns that energy to the input with the
    // magnetizing energy (the engine's small primary–reset share is not drawn). Their coupling is a hair below 1: with
    // three perfectly coupled pairs ngspice's matrix turns singular whenever DR opens; the 0.002 % left uncoupled rings
    // well under 1 % above the reset voltage.
    resetNetwork(p, n) {
      const r = p.resetTurnsRatio ?? 1;
      return [
        `* Tertiary (reset) winding Nr/Np = ${n(r)}, dot at ground, returning the magnetizing and leakage energy to the input through DR`,
        ...(p.llkH > 0 ? [`LLKR 0 rl ${n(p.llkH * r * r)}`, 'K4 LLK LLKR 0.99999', `LR rl rk ${n(p.lmH * r * r)}`] : [`LR 0 rk ${n(p.lmH * r * r)}`]),
        'K2 LP LR 1', 'K3 LS LR 1',
        'DR rk in DIDEAL',
      ];
    },
    magnetizingTerms: (p, n) => `+${n(p.resetTurnsRatio ?? 1)}*i(LR)`,
    measuresCoreVoltage: true,
  },
  resetLossW(d, _vinV, duty, primaryPeakA) {
    return vfOf(d) * d.magnetizingPeakA * duty / 2 + 0.5 * this.spikeLeakageH(d) * primaryPeakA * primaryPeakA * d.spec.fswHz;
  },
};
