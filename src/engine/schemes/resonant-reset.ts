import { RESONANT_RESET_DUTY, WINDING_CAPACITANCE_F } from '../assumptions';
import { E12, snapDownIn } from '../eseries';
import { chooseClampCap, withMargin } from './common';
import type { ResetSchemeModel } from './types';

/**
 * Reset-limited duty of resonant reset, Dmax = 1 − π·fs·√(Lm·Cr) (half a resonant period must
 * fit in the off time; derived; concept Murakami & Yamasaki, PESC 1988 [M]).
 */
export function resonantDutyLimit(fswHz: number, lmH: number, crF: number): number {
  if (!(lmH > 0) || !(crF > 0)) throw new RangeError(`Lm and Cr must be positive, got ${lmH} H, ${crF} F`);
  return 1 - Math.PI * fswHz * Math.sqrt(lmH * crF);
}

/**
 * Resonant reset peak above Vin, V = Vin·D/(2·fs·√(Lm·Cr)) = (ΔIm/2)·Z0; at the reset limit it
 * equals (π/2)·Vin·D/(1 − D) (derived from half-sine volt-seconds).
 */
export function resonantPeakV(kV: number, fswHz: number, lmH: number, crF: number): number {
  return kV / (2 * fswHz * Math.sqrt(lmH * crF));
}

/** Single-switch forward reset by the Lm–Cr resonance (Cr = Coss + winding C + an added capacitor). */
export const resonantReset: ResetSchemeModel = {
  id: 'resonant-reset',
  label: 'Resonant reset',
  switchCount: 1,
  bipolarFlux: true,
  leakageClamped: false,
  seriesSwitches: 1,
  clampAllowance: 0,
  diodeRole: 'clamp-diode',
  capacitorRole: 'resonant-capacitor',
  windingCount: 2,
  extraAmpereTurnsA: () => 0,
  restressAfterReset: true,
  formulas: {
    dutyLimit: 'Dlim = (1 − π·fs·√(Lm·Cr)) − margin, Cr chosen for a reset limit of 0.5',
    offState: 'Vds = Vin + Vin·D/(2·fs·√(Lm·Cr)) = Vin + (π/2)·K/(1 − Dr)',
    transient: 'Vds = Vin,max·(1 + Dlim/(2·fs·√(Lm·Cr))) when D reaches its limit at high line',
    forwardReverse: 'VR(D1) = n·Vres,pk',
    resetLoss: 'P = ½·Cadded·Vin²·fs + ½·Llk·Ip²·fs',
    source: 'derived; Murakami & Yamasaki, PESC 1988 [M]',
  },
  resetDutyLimit: () => RESONANT_RESET_DUTY,
  designDutyLimit: (spec) => withMargin(RESONANT_RESET_DUTY, spec.maxDuty),
  transientDuty: (d) => d.dutyLimit,
  prepare(d) {
    d.resonantPeakV = (Math.PI / 2) * d.kV / (1 - RESONANT_RESET_DUTY);
  },
  resetVoltageV: (d) => d.resonantPeakV,
  offStateV: (d, vinV) => vinV + d.resonantPeakV,
  transientV: (d) => d.spec.vinMaxV + d.resonantPeakV * (d.spec.vinMaxV * d.transientDuty) / d.kV,
  turnOnV: (_d, vinV) => vinV,
  sizeReset(d) {
    const s = d.spec;
    const root = (1 - RESONANT_RESET_DUTY) / (Math.PI * s.fswHz);
    const crTarget = (root * root) / d.lmH;
    const cNode = (d.mainSwitch ? d.mainSwitch.cossF * d.mainQty : 0) + WINDING_CAPACITANCE_F;
    d.addedCF = crTarget > cNode ? snapDownIn(crTarget - cNode, E12) : 0;
    d.resonantCF = cNode + d.addedCF;
    d.resetDutyLimit = resonantDutyLimit(s.fswHz, d.lmH, d.resonantCF);
    if (d.resetDutyLimit < d.dutyAtVinMin) d.fails.push('resonant-reset-incomplete');
    d.resonantPeakV = resonantPeakV(d.kV, s.fswHz, d.lmH, d.resonantCF);
    if (d.addedCF > 0) chooseClampCap(d, d.addedCF, s.vinMaxV + d.resonantPeakV);
    d.lowSideDrivers = 1;
  },
  // Nothing catches the leakage at turn-off: its energy rings into Cr (the spike the snubber limits).
  spikeLeakageH: (d) => d.llkH,
  magnetizingOffsetA: () => 0,
  // Cr is chosen so that half a resonant period fills 1 − Dr of the period; the half-cosine fall is taken as linear over
  // that time (its iGSE is about 7 % higher at α = 1.4; see src/engine/README.md).
  fluxFallShare: () => 1 - RESONANT_RESET_DUTY,
  resetLossW(d, vinV, _duty, primaryPeakA) {
    return 0.5 * d.addedCF * vinV * vinV * d.spec.fswHz + 0.5 * d.llkH * primaryPeakA * primaryPeakA * d.spec.fswHz;
  },
};
