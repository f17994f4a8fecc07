import type { Design } from './types';

/**
 * Leakage inductance and the duty cycle. Llk (referred to the primary) carries the whole primary
 * current, so every change of that current costs volt-seconds on Llk that neither the core nor
 * the output sees:
 *  - at turn-on Llk must take the reflected inductor current n·IL,min before D1 carries the whole
 *    load; until then both rectifiers conduct, the secondary is shorted and Lm sees no voltage
 *    (the commutation time tc = n·Llk·IL,min/Vin);
 *  - during the rest of the on time the primary current climbs by n·ΔIL + ΔIm, which drops
 *    Llk·(n·ΔIL + ΔIm)·fs on average across Llk.
 * Together the switch is on for D = (K + Llk·fs·(n·IL,max + ΔIm))/Vin, where K = (Vout + drops)/n
 * = Vin·(D − ΔD) is what reaches the core and the output, and the output loses
 * n·Llk·fs·(n·IL,max + ΔIm) against the leakage-free n·D·Vin (derived by volt-second balance on
 * Llk, Lm and the output inductor over one period).
 */

/** Magnetizing current swing over the on time, ΔIm = K/(Lm·fs) (derived: volt-seconds on Lm). */
function magnetizingSwingA(d: Design): number {
  return d.kV / (d.lmH * d.spec.fswHz);
}

const hasLeakage = (d: Design): boolean => d.llkH > 0 && d.lmH > 0;
/** Llk and the output inductor are both designed (the first pass has neither). */
const designed = (d: Design): boolean => hasLeakage(d) && d.outputInductanceH > 0;

/**
 * Peak-to-peak inductor ripple at an input voltage. The inductor charges for D − tc·fs at
 * n·V(Lm) − Vout − drops and discharges at Vout + drops for the rest, so with a = (Vout + drops)/(L·fs):
 * ΔIL = a·(1 − (K + Llk·fs·ΔIm)/Vin)/(1 + a·n·Llk·fs/Vin); a·(1 − K/Vin) without leakage
 * (buck ripple, Mohan, Undeland & Robbins ch. 7 [M]; the leakage terms derived as above).
 */
export function rippleAtA(d: Design, vinV: number): number {
  const s = d.spec;
  const a = (s.voutV + d.dropsV) / (d.outputInductanceH * s.fswHz);
  if (!hasLeakage(d)) return a * (1 - d.kV / vinV);
  const lf = d.llkH * s.fswHz;
  return (a * (1 - (d.kV + lf * magnetizingSwingA(d)) / vinV)) / (1 + (a * d.turnsRatio * lf) / vinV);
}

/** Llk/Lm of the design so far (0 before Lm is known): the spec's ratio or the build's estimate. */
export function leakageShare(d: Design): number {
  return hasLeakage(d) ? d.llkH / d.lmH : 0;
}

/** Volt-seconds × fs taken by the leakage at an input voltage, Llk·fs·(n·IL,max + ΔIm) (V; 0 before Llk is known). */
export function leakageVoltSecondsV(d: Design, vinV: number): number {
  if (!designed(d)) return 0;
  const ilMax = d.spec.ioutA + rippleAtA(d, vinV) / 2;
  return d.llkH * d.spec.fswHz * (d.turnsRatio * ilMax + magnetizingSwingA(d));
}

/** Switch duty at an input voltage, D = (K + Llk·fs·(n·IL,max + ΔIm))/Vin (derived, see above). */
export function switchDutyAt(d: Design, vinV: number): number {
  return (d.kV + leakageVoltSecondsV(d, vinV)) / vinV;
}

/** Share of the period in which the leakage commutates the rectifiers, tc·fs = n·Llk·IL,min·fs/Vin (derived). */
export function commutationDutyAt(d: Design, vinV: number): number {
  if (!designed(d)) return 0;
  const ilMin = Math.max(0, d.spec.ioutA - rippleAtA(d, vinV) / 2);
  return (d.turnsRatio * d.llkH * ilMin * d.spec.fswHz) / vinV;
}

/** c = Llk·IL,max·fs at an input voltage (V), the coefficient of n² in the turns-ratio equation; 0 before Llk is known. */
export function leakageCoefficientV(d: Design, vinV: number): number {
  if (!designed(d)) return 0;
  return d.llkH * (d.spec.ioutA + rippleAtA(d, vinV) / 2) * d.spec.fswHz;
}

/**
 * Turns ratio that reaches the output at the duty limit at Vin,min with the leakage:
 * n·Dlim·Vin,min = (Vout + drops)·(1 + Llk/Lm) + c·n² (ΔIm·Llk·fs·n = (Vout + drops)·Llk/Lm), the
 * smaller root (the larger one spends most of the duty on the leakage). NaN when no ratio reaches
 * the output. With c = 0 and Llk = 0 it is n = (Vout + drops)/(Dlim·Vin,min). Derived.
 */
export function turnsRatioWithLeakage(voPlusDropsV: number, leakageRatio: number, cV: number, dutyLimit: number, vinMinV: number): number {
  const b = dutyLimit * vinMinV;
  const v = voPlusDropsV * (1 + leakageRatio);
  const disc = b * b - 4 * cV * v;
  if (disc < 0) return NaN;
  // Numerically stable form of (b − √disc)/(2c), which is also right for c = 0.
  return (2 * v) / (b + Math.sqrt(disc));
}
