import { SPIKE_FRACTION, WINDING_CAPACITANCE_F } from '../assumptions';
import { unitPriceAt } from '../parts/index-library';
import type { MosfetPart } from '../parts/types';
import { picked, selectCapacitor, selectMosfet, selectRectifier, selectResistor } from '../parts/select';
import type { ResetSchemeModel } from '../schemes/types';
import { switchDutyAt } from './duty';
import type { Design } from './types';

/**
 * Worst steady off-state voltage over the range. Every scheme's Vds(Vin) is monotonic or convex
 * (active clamp: U-shaped), so the worst case sits at one end of the range (derived).
 */
export function peakOffStateV(d: Design, model: ResetSchemeModel): number {
  return Math.max(model.offStateV(d, d.spec.vinMinV), model.offStateV(d, d.spec.vinMaxV));
}

/**
 * Unclamped leakage spike Vspike ≈ Ip·√(Llk/C) (energy ½·Llk·Ip² into the node capacitance;
 * derived by energy balance; common practice).
 */
export function leakageSpikeV(primaryPeakA: number, llkH: number, nodeCapF: number): number {
  if (!(nodeCapF > 0)) throw new RangeError(`node capacitance must be positive, got ${nodeCapF} F`);
  return primaryPeakA * Math.sqrt(llkH / nodeCapF);
}

/**
 * Capacitance the magnetizing inductance rings with once a unipolar reset has ended: the main switch's Co(er) (the two
 * switches of the two-switch forward in series across the primary, so half of one) plus the winding capacitance.
 * 0 before the switch is chosen.
 */
export function ringCapacitanceF(d: Design, model: ResetSchemeModel): number {
  if (!d.mainSwitch) return 0;
  return (d.mainSwitch.cossF * d.mainQty) / model.seriesSwitches + WINDING_CAPACITANCE_F;
}

/**
 * Phase θ ∈ [0, π/2] reached by the drain ring: θ − sin θ = x (Newton; x ≥ π/2 − 1 gives the full quarter, x ≤ 0 none).
 * See `ringCurrentA` for where the equation comes from.
 */
export function ringPhase(x: number): number {
  if (!(x > 0)) return 0;
  if (x >= Math.PI / 2 - 1) return Math.PI / 2;
  let th = Math.min(Math.PI / 2, Math.cbrt(6 * x));
  for (let k = 0; k < 8; k++) th -= (th - Math.sin(th) - x) / (1 - Math.cos(th));
  return Math.min(Math.PI / 2, th);
}

/**
 * Magnetizing current the drain ring leaves at the next turn-on in a unipolar scheme (A, ≥ 0; the current is −I0).
 * When the reset current reaches zero the drain sits at Vin + Vr (Vr the reset voltage across the primary) and the node
 * capacitance C rings with Lm back towards Vin: with the input in the loop C gives up ½·C·Vr², so the current is
 * −A·sin(ω·t), A = Vr·√(C/Lm), ω = 1/√(Lm·C). At Vin the transformer voltage crosses zero, the secondary rectifiers
 * short it and the current stays at −A until turn-on. A dead time too short for a quarter period stops it at −A·sin θ.
 * The period then starts at −I0, so the reset (at Vr, from ΔIm − I0 down to zero) ends I0·Lm/Vr earlier than from
 * ΔIm: θ = ω·(t0 + I0·Lm/Vr) with t0 = tOff − ΔIm·Lm/Vr, and since ω·Lm/Vr = 1/A that is θ − sin θ = ω·t0 (derived by
 * volt-second balance on Lm; the ngspice cross-check sees the ring). At most ΔIm/2, see below.
 */
export function ringCurrentA(d: Design, model: ResetSchemeModel, vinV: number): number {
  const c = ringCapacitanceF(d, model);
  if (model.bipolarFlux || !(c > 0) || !(d.lmH > 0)) return 0;
  const s = d.spec;
  // The back stages ask at the three lines, whose duties the front stages have settled.
  const duty = vinV === s.vinMinV ? d.dutyAtVinMin : vinV === s.vinNomV ? d.dutyAtVinNom : vinV === s.vinMaxV ? d.dutyAtVinMax : switchDutyAt(d, vinV);
  const tOffS = (1 - duty) / s.fswHz;
  const vr = model.resetVoltageV(d, vinV);
  const t0 = tOffS - (d.magnetizingSwingA * d.lmH) / vr;
  const ring = vr * Math.sqrt(c / d.lmH) * Math.sin(ringPhase(t0 / Math.sqrt(d.lmH * c)));
  // A ring that would leave more than half the swing means the node resets the core by itself, resonantly: the current
  // then swings ±ΔIm/2 and the drain peaks at Vin + (ΔIm/2)·√(Lm/C), below the clamp (derived; the figures above then
  // err high).
  return Math.min(ring, d.magnetizingSwingA / 2);
}

/**
 * Magnetizing current at the start of the on time at vinV: −I0 of the drain ring for the unipolar schemes (0 before the
 * switch is chosen), offset − ΔIm/2 for the bipolar ones (design/magnetics.ts).
 */
export function magnetizingStartAt(d: Design, model: ResetSchemeModel, vinV: number): number {
  if (model.bipolarFlux) return model.magnetizingOffsetA(d, vinV) - d.magnetizingSwingA / 2;
  // The three lines' rings, kept by settleMagnetizing (the losses and the efficiency curve ask for them again and again).
  const s = d.spec;
  if (vinV === s.vinNomV && d.ringNomA >= 0) return -d.ringNomA;
  if (vinV === s.vinMinV && d.ringMinA >= 0) return -d.ringMinA;
  if (vinV === s.vinMaxV && d.ringMaxA >= 0) return -d.ringMaxA;
  return -ringCurrentA(d, model, vinV);
}

/**
 * Once the main switch is known, a unipolar scheme's magnetizing current starts each period at −I0 (the drain ring):
 * its peak at turn-off is ΔIm − I0, the larger at the end of the range where the ring leaves less (derived; see
 * `ringCurrentA`). The primary currents follow.
 */
export function settleMagnetizing(d: Design, model: ResetSchemeModel): void {
  if (model.bipolarFlux) return;
  d.ringMinA = ringCurrentA(d, model, d.spec.vinMinV);
  d.ringNomA = ringCurrentA(d, model, d.spec.vinNomV);
  d.ringMaxA = ringCurrentA(d, model, d.spec.vinMaxV);
  d.magnetizingStartA = -Math.min(d.ringMinA, d.ringMaxA);
  d.magnetizingPeakA = d.magnetizingSwingA + d.magnetizingStartA;
  designCurrents(d, model);
}

/**
 * Rms of the switch current over a period at duty D: in the on time the reflected inductor current and the magnetizing
 * current both ramp linearly, so i(x) = a + (b − a)·x with a, b the currents at the start and end of the on time, and
 * rms² = D·(a² + a·b + b²)/3 (derived; exact for the trapezoid plus ramp, cross term included).
 */
export function switchRmsA(duty: number, startA: number, endA: number): number {
  return Math.sqrt((duty * (startA * startA + startA * endA + endA * endA)) / 3);
}

/** Primary peak and rms current at Vin,min, full load (reflected load + magnetizing with its offset; derived). */
export function designCurrents(d: Design, model: ResetSchemeModel): void {
  const s = d.spec;
  const im0 = magnetizingStartAt(d, model, s.vinMinV);
  const start = d.turnsRatio * (s.ioutA - d.rippleA / 2) + im0;
  d.primaryPeakA = d.turnsRatio * (s.ioutA + d.rippleA / 2) + im0 + d.magnetizingSwingA;
  d.primaryRmsA = switchRmsA(d.dutyAtVinMin, start, d.primaryPeakA);
}

function pickMainSwitch(d: Design, minV: number, forcedId: string | undefined): void {
  if (forcedId) {
    const m = d.index.byId.get(forcedId) as MosfetPart | undefined;
    d.mainSwitch = m && 'vdsV' in m ? m : null;
    d.mainQty = 1;
    d.mainPrice = d.mainSwitch ? unitPriceAt(d.mainSwitch.tiers, d.spec.annualVolume) : 0;
    return;
  }
  const list = d.index.nMosfets;
  const i = selectMosfet(list, d.prices.nMosfets, minV, d.primaryRmsA, d.poutW);
  d.mainSwitch = i >= 0 ? list[i]! : null;
  d.mainQty = i >= 0 ? picked.qty : 1;
  d.mainPrice = i >= 0 ? d.prices.nMosfets[i]! : 0;
}

/**
 * Stage 5: switch peak, transient, spike allowance (snubber-limited to 10 % where nothing clamps
 * the leakage), design stress, and the cheapest main switch rated ≥ stress/derating.
 */
export function designStress(d: Design, model: ResetSchemeModel): void {
  const s = d.spec;
  d.switchPeakV = peakOffStateV(d, model);
  d.transientV = Math.max(model.transientV(d), d.switchPeakV);
  const base = Math.max(d.switchPeakV * (1 + model.clampAllowance), d.transientV);
  const forcedId = d.ov?.partIds?.mainSwitch;
  d.spikeV = 0;
  d.snubberNeeded = false;
  if (!model.leakageClamped) {
    pickMainSwitch(d, (base + SPIKE_FRACTION * d.switchPeakV) / s.voltageDerating, forcedId);
    const cNode = (d.mainSwitch ? d.mainSwitch.cossF * d.mainQty : 0) + WINDING_CAPACITANCE_F + (d.addedCF > 0 ? d.addedCF : 0);
    const raw = leakageSpikeV(d.primaryPeakA, model.spikeLeakageH(d), cNode);
    d.snubberNeeded = raw > SPIKE_FRACTION * d.switchPeakV;
    d.spikeV = Math.min(raw, SPIKE_FRACTION * d.switchPeakV);
    if (d.snubberNeeded) {
      // Cs so that Ip·√(Llk/(Cnode + Cs)) = 10 % of the peak (derived).
      const vMax = SPIKE_FRACTION * d.switchPeakV;
      d.snubberCapF = Math.max(0, model.spikeLeakageH(d) * (d.primaryPeakA / vMax) ** 2 - cNode);
    }
  }
  d.switchStressV = base + d.spikeV;
  pickMainSwitch(d, d.switchStressV / s.voltageDerating, forcedId);
  if (!d.mainSwitch) { d.fails.push(forcedId ? 'unknown-part' : 'no-switch-for-stress'); d.switchRatingV = NaN; return; }
  d.switchRatingV = d.mainSwitch.vdsV;
  if (d.switchRatingV * s.voltageDerating < d.switchStressV * (1 - 1e-9)) d.fails.push('no-switch-for-stress');
}

/** Snubber (diode + R + C) parts for an unclamped scheme whose leakage spike needs limiting (common practice). */
export function designSnubber(d: Design, model: ResetSchemeModel): void {
  if (!d.snubberNeeded) return;
  const s = d.spec;
  const ix = d.index;
  const vR = d.switchStressV;
  const pW = 0.5 * model.spikeLeakageH(d) * d.primaryPeakA * d.primaryPeakA * s.fswHz;
  const di = selectRectifier(ix.clampDiodes, d.prices.clampDiodes, vR / s.voltageDerating, pW / Math.max(d.switchPeakV, 1));
  d.snubberDiode = di >= 0 ? ix.clampDiodes[di]! : null;
  d.snubberDiodePrice = di >= 0 ? d.prices.clampDiodes[di]! : 0;
  const ci = selectCapacitor(ix.capacitors, d.prices.capacitors, vR / s.voltageDerating, d.snubberCapF, Infinity);
  d.snubberCap = ci >= 0 ? ix.capacitors[ci]! : null;
  d.snubberCapPrice = ci >= 0 ? d.prices.capacitors[ci]! : 0;
  const ri = selectResistor(ix.resistors, pW, vR);
  d.snubberRes = ri >= 0 ? ix.resistors[ri]! : null;
  d.snubberResPrice = ri >= 0 ? d.prices.resistors[ri]! : 0;
  if (!d.snubberDiode || !d.snubberCap || !d.snubberRes) d.fails.push('no-clamp-part');
}
