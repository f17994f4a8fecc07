import { CAP_TOLERANCE, RDS_HOT_FACTOR, WINDING_DROP_SHARE } from '../assumptions';
import { E12, E6, snapUpIn } from '../eseries';
import { capacitanceForRippleF, inductanceForRippleH, inductorRippleA } from '../filter';
import type { MosfetPart, RectifierPart } from '../parts/types';
import { unitPriceAt } from '../parts/index-library';
import { picked, selectCapacitor, selectInductor, selectMosfet, selectRectifier } from '../parts/select';
import type { ResetSchemeModel } from '../schemes/types';
import { leakageShare, rippleAtA, turnsRatioWithLeakage } from './duty';
import type { Design } from './types';

/**
 * Turns ratio from the lowest input at the duty limit: Vout + drops = n·D·Vin
 * (volt-second balance on the output inductor with VF1 = VF2; derived).
 */
export function turnsRatioFor(voutV: number, dropsV: number, dutyLimit: number, vinMinV: number): number {
  if (!(dutyLimit > 0 && dutyLimit < 1)) throw new RangeError(`duty limit must be in (0, 1), got ${dutyLimit}`);
  if (!(vinMinV > 0)) throw new RangeError(`vinMinV must be positive, got ${vinMinV}`);
  return (voutV + dropsV) / (dutyLimit * vinMinV);
}

function rectifierDrop(d: Design): number {
  if (d.rectSr) return (d.spec.ioutA * d.rectSr.rdsOnOhm * RDS_HOT_FACTOR) / d.rectQty;
  return d.rectDiode ? d.rectDiode.vfV : 0.5;
}

/**
 * Rectifier reverse voltages: forward D1 n × the reset voltage, worst end of the range; freewheel D2 n·Vin,max (derived
 * by volt-second balance on the transformer). The pipeline sets them again once the design has settled, since the reset
 * voltage can read the leakage of the last pass.
 */
export function setRectifierVoltages(d: Design, model: ResetSchemeModel): void {
  d.rectForwardV = d.turnsRatio * Math.max(model.resetVoltageV(d, d.spec.vinMinV), model.resetVoltageV(d, d.spec.vinMaxV));
  d.rectFreewheelV = d.turnsRatio * d.spec.vinMaxV;
}

/**
 * Rectifier reverse voltages (forward D1: n × reset voltage, worst end of the range; freewheel D2:
 * n·Vin,max; derived by volt-second balance on the transformer) and the cheapest part blocking
 * both with derating.
 */
export function chooseRectifier(d: Design, model: ResetSchemeModel): void {
  const s = d.spec;
  const forcedId = d.ov?.partIds?.rectifier;
  setRectifierVoltages(d, model);
  const vr = Math.max(d.rectForwardV, d.rectFreewheelV) / s.voltageDerating;
  const dutyWorst = Math.max(d.dutyLimit, 1 - d.kV / s.vinMaxV);
  if (forcedId) {
    const part = d.index.byId.get(forcedId);
    // The forced part must be of the kind the rectifier setting asks for, or it is an unknown part.
    const kindList: readonly unknown[] = s.rectifier === 'synchronous' ? d.index.srMosfets : d.index.rectifiers;
    const forced = part && kindList.includes(part) ? (part as MosfetPart & RectifierPart) : undefined;
    if (!forced) d.fails.push('unknown-part');
    if (s.rectifier === 'synchronous') d.rectSr = forced ?? null; else d.rectDiode = forced ?? null;
    d.rectQty = 1;
    d.rectPrice = forced ? unitPriceAt(forced.tiers, s.annualVolume) : 0;
  } else if (s.rectifier === 'synchronous') {
    const list = d.index.srMosfets;
    const i = selectMosfet(list, d.prices.srMosfets, vr, s.ioutA * Math.sqrt(dutyWorst), d.poutW);
    d.rectSr = i >= 0 ? list[i]! : null;
    d.rectQty = i >= 0 ? picked.qty : 1;
    d.rectPrice = i >= 0 ? d.prices.srMosfets[i]! : 0;
  } else {
    const list = d.index.rectifiers;
    const i = selectRectifier(list, d.prices.rectifiers, vr, s.ioutA * dutyWorst);
    d.rectDiode = i >= 0 ? list[i]! : null;
    d.rectQty = i >= 0 ? picked.qty : 1;
    d.rectPrice = i >= 0 ? d.prices.rectifiers[i]! : 0;
  }
}

/**
 * Stage 1–2: duty limit, rectifier drop, turns ratio and volt-seconds K. The first pass has no
 * leakage figure yet (leakageCoefficientV = 0); the pipeline repeats this stage once Llk is known, and
 * sets the switch duties at three lines afterwards (design/duty.ts).
 */
export function designConversion(d: Design, model: ResetSchemeModel): void {
  const s = d.spec;
  const ov = d.ov;
  d.resetDutyLimit = model.resetDutyLimit(s);
  d.dutyLimit = ov?.dutyLimit ?? model.designDutyLimit(s);
  if (d.dutyLimit > d.resetDutyLimit + 1e-12) d.fails.push('duty-limit-above-reset');
  d.windingDropV = WINDING_DROP_SHARE * s.voutV;
  for (let pass = 0; pass < 2; pass++) {
    const used = d.rectSr ?? d.rectDiode;
    const usedQty = d.rectQty;
    d.rectifierDropV = rectifierDrop(d);
    d.dropsV = d.rectifierDropV + d.windingDropV;
    d.turnsRatio = ov?.turnsRatio ?? ratioAtDutyLimit(d);
    d.kV = (s.voutV + d.dropsV) / d.turnsRatio;
    model.prepare(d);
    chooseRectifier(d, model);
    // The drop came from the part just chosen again (a later leakage pass): a second round would repeat this one.
    if (used !== null && (d.rectSr ?? d.rectDiode) === used && d.rectQty === usedQty) break;
  }
  if (!d.rectSr && !d.rectDiode) d.fails.push('no-rectifier');
}

/**
 * Turns ratio at the duty limit, with the leakage commutation loss once it is known. When no
 * ratio reaches the output, the ratio of the largest output (n = Dlim·Vin,min/(2c)) keeps every
 * figure defined; the pipeline records the failure once the design has settled.
 */
function ratioAtDutyLimit(d: Design): number {
  const s = d.spec;
  const c = d.leakageCoefficientV;
  if (!(c > 0)) return turnsRatioFor(s.voutV, d.dropsV, d.dutyLimit, s.vinMinV);
  const n = turnsRatioWithLeakage(s.voutV + d.dropsV, leakageShare(d), c, d.dutyLimit, s.vinMinV);
  return Number.isFinite(n) ? n : (d.dutyLimit * s.vinMinV) / (2 * c);
}

/** Stage 3: output L for the ripple ratio (E12, snapped up) and C for the ripple voltage (E6, snapped up). */
export function designFilter(d: Design): void {
  const s = d.spec;
  const voPlusDrop = s.voutV + d.dropsV;
  const target = s.rippleRatio * s.ioutA;
  // The inductor charges for the switch duty less the commutation time (design/duty.ts); Llk and Lm are
  // those of the previous pass (none in the first).
  const lkV = d.llkH > 0 && d.lmH > 0 ? d.llkH * s.fswHz * (d.turnsRatio * target + d.kV / (d.lmH * s.fswHz)) : 0;
  // Capped so every figure stays defined when the leakage alone would fill the period (the duty check flags that design).
  const dMin = Math.min((d.kV + lkV) / s.vinMaxV, 0.95);
  const snapped = snapUpIn(inductanceForRippleH(voPlusDrop, dMin, target, s.fswHz), E12);
  // A later pass never steps L down (see designMagnetics: the passes must settle, not swing).
  d.outputInductanceH = d.leakageCoefficientV > 0 && d.outputInductanceH > snapped ? d.outputInductanceH : snapped;
  // An overridden turns ratio can ask for more volt-seconds than high line gives: the ripple at the capped duty keeps
  // the filter defined, and the duty check flags the design.
  const atMax = rippleAtA(d, s.vinMaxV);
  d.rippleA = atMax > 0 ? atMax : inductorRippleA(voPlusDrop, dMin, d.outputInductanceH, s.fswHz);
  // Half the ripple budget to capacitance, half to ESR (common practice).
  const cMin = capacitanceForRippleF(d.rippleA, s.fswHz, s.voutRippleV / 2);
  d.outputCapacitanceF = snapUpIn(cMin / (1 - CAP_TOLERANCE), E6);
  const caps = d.index.capacitors;
  const c = selectCapacitor(caps, d.prices.capacitors, s.voutV / s.voltageDerating, d.outputCapacitanceF, s.voutRippleV / 2 / d.rippleA);
  if (c >= 0) { d.outCap = caps[c]!; d.outCapQty = picked.qty; d.outCapPrice = d.prices.capacitors[c]!; } else d.fails.push('no-output-capacitor');
  const iPk = s.ioutA + d.rippleA / 2;
  const l = selectInductor(d.index.inductors, 0.5 * d.outputInductanceH * iPk * iPk);
  if (l >= 0) { d.inductor = d.index.inductors[l]!; d.inductorPrice = d.prices.inductors[l]!; } else d.fails.push('no-output-inductor');
}
