import { SPIKE_FRACTION, WINDING_CAPACITANCE_F } from '../assumptions';
import { unitPriceAt } from '../parts/index-library';
import type { MosfetPart } from '../parts/types';
import { picked, selectCapacitor, selectMosfet, selectRectifier, selectResistor } from '../parts/select';
import type { ResetSchemeModel } from '../schemes/types';
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

/** Magnetizing current at the start of the on time at vinV: 0 unipolar, offset − ΔIm/2 bipolar (design/magnetics.ts). */
export function magnetizingStartAt(d: Design, model: ResetSchemeModel, vinV: number): number {
  return model.bipolarFlux ? model.magnetizingOffsetA(d, vinV) - d.magnetizingSwingA / 2 : 0;
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
