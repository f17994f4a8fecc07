import { RESONANT_RESET_DUTY, WINDING_CAPACITANCE_F } from '../assumptions';
import { E12, snapDownIn } from '../eseries';
import { rippleAtA } from '../design/duty';
import type { Design } from '../design/types';
import { chooseClampCap, withMargin } from './common';
import { GROUNDED_SWITCH } from './netlist-common';
import { arcKnots } from './off-shape';
import type { ResetSchemeModel } from './types';
import { SCHEME_LABELS } from '../scheme-ids';

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

/**
 * Leakage energy that joins the resonance at turn-off (derived). Nothing clamps the leakage: when the drain passes Vin
 * the commutating secondary holds Lm at 0 V, and the leakage hands its current over to Cr, from Ip = n·IL,max + I2 down
 * to the magnetizing current I2, leaving E = ½·Llk·(Ip² − I2²) in Cr. When the secondary lets go, that charge is where
 * the Lm–Cr resonance starts from (the fast Llk–Cr mode gets only Llk/Lm of it), so the tank holds ½·Lm·I2² + E and
 * ends the half-cycle at −I1 with ½·Lm·I1² = ½·Lm·I2² + E. With I1 + I2 = ΔIm (the on-time's rise) the magnetizing
 * current swings about an offset −(I1 − I2)/2 = −E/(Lm·ΔIm), and E itself, with a = n·IL,max and I2 = ΔIm/2 + offset,
 * is E = ½·Llk·a·(a + ΔIm)/(1 + Llk·a/(Lm·ΔIm)). The energy goes back to the input through the negative current in the
 * next on time; the resonant peak rises with I1: Vres = Z0·I1.
 */
export function resonantLeakageEnergyJ(llkH: number, lmH: number, reflectedA: number, swingA: number): number {
  if (!(llkH > 0) || !(lmH > 0) || !(swingA > 0)) return 0;
  return (0.5 * llkH * reflectedA * (reflectedA + swingA)) / (1 + (llkH * reflectedA) / (lmH * swingA));
}

/** Dc offset of the resonant reset's magnetizing current at vinV, −E/(Lm·ΔIm) (see resonantLeakageEnergyJ). */
function offsetAt(d: Design, vinV: number): number {
  const swing = d.magnetizingSwingA;
  if (!(d.llkH > 0) || !(d.lmH > 0) || !(swing > 0) || !(d.outputInductanceH > 0)) return 0;
  const e = resonantLeakageEnergyJ(d.llkH, d.lmH, d.turnsRatio * (d.spec.ioutA + rippleAtA(d, vinV) / 2), swing);
  return -e / (d.lmH * swing);
}

/**
 * Resonant peak above Vin at vinV: Z0·I1 with I1 = ΔIm/2 + |offset| (the leakage's share; derived above); d.resonantPeakV
 * holds the symmetric Z0·ΔIm/2.
 */
function peakAt(d: Design, vinV: number): number {
  const half = d.magnetizingSwingA / 2;
  return half > 0 ? d.resonantPeakV * (1 - offsetAt(d, vinV) / half) : d.resonantPeakV;
}

/** Single-switch forward reset by the Lm–Cr resonance (Cr = Coss + winding C + an added capacitor). */
export const resonantReset: ResetSchemeModel = {
  id: 'resonant-reset',
  label: SCHEME_LABELS['resonant-reset'],
  switchCount: 1,
  bipolarFlux: true,
  // The leakage energy joins the resonance and returns to the input (resonantLeakageEnergyJ): no spike of its own.
  leakageClamped: true,
  seriesSwitches: 1,
  clampAllowance: 0,
  diodeRole: 'clamp-diode',
  capacitorRole: 'resonant-capacitor',
  windingCount: 2,
  extraAmpereTurnsA: () => 0,
  restressAfterReset: true,
  formulas: {
    dutyLimit: 'Dlim = (1 − π·fs·√(Lm·Cr)) − margin, Cr chosen for a reset limit of 0.5',
    offState: 'Vds = Vin + Z0·I1, Z0 = √(Lm/Cr), I1 = ΔIm/2 + E/(Lm·ΔIm), E = ½·Llk·a·(a + ΔIm)/(1 + Llk·a/(Lm·ΔIm)), a = n·IL,max (the leakage energy joins the resonance)',
    transient: 'Vds = Vin,max + Vres·Vin,max·Dlim/K when D reaches its limit at high line',
    forwardReverse: 'VR(D1) = n·Vres,pk',
    resetLoss: 'P = ½·Cadded·Vin²·fs (the leakage energy returns to the input through the magnetizing current)',
    source: 'derived (energy and volt-second balance of the Lm–Cr resonance); Murakami & Yamasaki, PESC 1988 [M]',
  },
  resetDutyLimit: () => RESONANT_RESET_DUTY,
  designDutyLimit: (spec) => withMargin(RESONANT_RESET_DUTY, spec.maxDuty),
  transientDuty: (d) => d.dutyLimit,
  prepare(d) {
    d.resonantPeakV = (Math.PI / 2) * d.kV / (1 - RESONANT_RESET_DUTY);
  },
  resetVoltageV: peakAt,
  offStateV: (d, vinV) => vinV + peakAt(d, vinV),
  transientV: (d) => d.spec.vinMaxV + peakAt(d, d.spec.vinMaxV) * (d.spec.vinMaxV * d.transientDuty) / d.kV,
  turnOnV: (_d, vinV) => vinV,
  sizeReset(d) {
    const s = d.spec;
    const root = (1 - RESONANT_RESET_DUTY) / (Math.PI * s.fswHz);
    const crTarget = (root * root) / d.lmH;
    const cNode = (d.mainSwitch ? d.mainSwitch.cossF * d.mainQty : 0) + WINDING_CAPACITANCE_F;
    d.addedCF = crTarget > cNode ? snapDownIn(crTarget - cNode, E12) : 0;
    d.resonantCF = cNode + d.addedCF;
    d.resetDutyLimit = resonantDutyLimit(s.fswHz, d.lmH, d.resonantCF);
    // The controller may reach its duty limit in a transient, so the resonance must finish within it too.
    if (d.resetDutyLimit < Math.max(d.dutyAtVinMin, d.dutyLimit)) d.fails.push('resonant-reset-incomplete');
    d.resonantPeakV = resonantPeakV(d.kV, s.fswHz, d.lmH, d.resonantCF);
    if (d.addedCF > 0) chooseClampCap(d, d.addedCF, s.vinMaxV + peakAt(d, s.vinMaxV));
    d.lowSideDrivers = 1;
  },
  spikeLeakageH: () => 0,
  magnetizingOffsetA: offsetAt,
  // Cr is chosen so that half a resonant period fills 1 − Dr of the period; the half-cosine fall is taken as linear over
  // that time (its iGSE is about 7 % higher at α = 1.4; see src/engine/README.md).
  fluxFallShare: () => 1 - RESONANT_RESET_DUTY,
  // The tank starts where the leakage left it (Cr above Vin, current I2 = imEnd) and swings with peak current
  // I1 = ΔIm − I2: v = Vin + Z0·I1·sin(ωx + φ0), im = I1·cos(ωx + φ0), cos φ0 = I2/I1, until the drain is back at Vin
  // and the current at −I1 (derived above).
  offShape(d, vinV, tOffS, imEnd) {
    const omega = 1 / Math.sqrt(d.lmH * d.resonantCF);
    const i1 = d.magnetizingSwingA - imEnd;
    const vPk = peakAt(d, vinV);
    const phi0 = Math.acos(Math.max(-1, Math.min(1, imEnd / i1)));
    const th = Math.min((Math.PI - phi0) / omega, tOffS);
    const knots = [0];
    arcKnots(0, th, knots);
    // The drawn peak is the real one: a knot where the sine tops out.
    const xPeak = (Math.PI / 2 - phi0) / omega;
    if (xPeak > 0 && xPeak < th) knots.splice(knots.findIndex((x) => x > xPeak), 0, xPeak);
    if (th < tOffS) knots.push(tOffS);
    return {
      knots,
      v: (x) => (x >= th ? vinV : vinV + vPk * Math.sin(omega * x + phi0)),
      im: (x) => (x >= th ? -i1 : i1 * Math.cos(omega * x + phi0)),
    };
  },
  primaryOffA: (imA) => imA,
  ownFindings: () => [],
  resetWindingRatio: () => null,
  netlist: {
    switchStage: GROUNDED_SWITCH,
    // Cr holds the switch's Co(er) and the winding capacitance already.
    nodeCapacitance: () => [],
    // The leakage hands its energy to Cr at turn-off and the Lm–Cr resonance starts from there (the model above).
    resetNetwork: (p, n) => [
      '* Resonant reset: total drain-node capacitance (switch, winding and added capacitor) resonates with Lm',
      `CR d 0 ${n(p.resonantCapacitanceF ?? 1e-9)} IC=${n(p.vinV)}`,
    ],
    magnetizingTerms: () => '',
    measuresCoreVoltage: true,
  },
  resetLossW(d, vinV) {
    return 0.5 * d.addedCF * vinV * vinV * d.spec.fswHz;
  },
};
