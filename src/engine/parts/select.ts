import {
  CONDUCTION_BUDGET, CURRENT_DERATING, MAX_PARALLEL, RDS_HOT_FACTOR, RECTIFIER_CURRENT_MARGIN, RESISTOR_POWER_DERATING,
} from '../assumptions';
import { lowerBound, unitPriceAt } from './index-library';
import type { CapacitorPart, CorePart, InductorPart, MosfetPart, RectifierPart, ResistorPart } from './types';

/** A chosen part and how many sit in parallel in its position. */
export interface Choice<T> {
  part: T;
  qty: number;
}

const byVds = (m: MosfetPart): number => m.vdsV;
const byVrrm = (r: RectifierPart): number => r.vrrmV;
const byVoltage = (c: CapacitorPart): number => c.voltageV;
const byPower = (r: ResistorPart): number => r.powerW;
const byEnergy = (p: InductorPart): number => p.energyJ;
/** Candidates scanned past the lower bound (keeps selection O(log n + small)). */
const SCAN = 8;

/**
 * Cheapest MOSFET with Vds ≥ `minVdsV`, paralleled so that each part carries ≤ 0.6·ID
 * (MIL-DTL-917 Table XIX) and the position's hot conduction loss stays within 0.5 % of Pout
 * (common practice); if no part meets the budget, the lowest-loss bank. Only the lowest voltage class that qualifies and the next are scanned.
 */
export function selectMosfet(list: MosfetPart[], minVdsV: number, irmsA: number, poutW: number, volume: number): Choice<MosfetPart> | null {
  const start = lowerBound(list, minVdsV, byVds);
  let best: MosfetPart | null = null;
  let bestQty = 0;
  let bestCost = Infinity;
  let fallback: MosfetPart | null = null;
  let fallbackLoss = Infinity;
  let classes = 0;
  let lastV = -1;
  const budgetW = CONDUCTION_BUDGET * poutW;
  for (let i = start; i < list.length && i < start + SCAN; i++) {
    const m = list[i]!;
    if (m.vdsV !== lastV) { classes++; lastV = m.vdsV; if (classes > 2) break; }
    let qty = Math.max(1, Math.ceil(irmsA / (CURRENT_DERATING * m.idA)));
    const lossOne = irmsA * irmsA * m.rdsOnOhm * RDS_HOT_FACTOR;
    while (qty < MAX_PARALLEL && lossOne / qty > budgetW) qty++;
    if (lossOne / qty > budgetW || qty > MAX_PARALLEL) {
      // Budget not met even in parallel: remember the lowest-loss fallback.
      if (lossOne / MAX_PARALLEL < fallbackLoss) { fallback = m; fallbackLoss = lossOne / MAX_PARALLEL; }
      continue;
    }
    const cost = qty * unitPriceAt(m.tiers, volume);
    if (cost < bestCost) { best = m; bestQty = qty; bestCost = cost; }
  }
  if (best) return { part: best, qty: bestQty };
  return fallback ? { part: fallback, qty: MAX_PARALLEL } : null;
}

/**
 * Cheapest rectifier with VRRM ≥ `minVrrmV`, paralleled so the average current is at most
 * IF/1.5 (common practice).
 */
export function selectRectifier(list: RectifierPart[], minVrrmV: number, iavgA: number, volume: number): Choice<RectifierPart> | null {
  const start = lowerBound(list, minVrrmV, byVrrm);
  let best: RectifierPart | null = null;
  let bestQty = 0;
  let bestCost = Infinity;
  for (let i = start; i < list.length && i < start + SCAN; i++) {
    const r = list[i]!;
    const qty = Math.max(1, Math.ceil((RECTIFIER_CURRENT_MARGIN * iavgA) / r.ifA));
    if (qty > MAX_PARALLEL) continue;
    const cost = qty * unitPriceAt(r.tiers, volume);
    if (cost < bestCost) { best = r; bestQty = qty; bestCost = cost; }
  }
  return best ? { part: best, qty: bestQty } : null;
}

/**
 * Cheapest capacitor bank with rating ≥ `minVoltageV` giving ≥ `minCapF` in total and, when
 * `maxEsrOhm` is finite, parallel ESR ≤ `maxEsrOhm` (qty up to 20).
 */
export function selectCapacitor(list: CapacitorPart[], minVoltageV: number, minCapF: number, maxEsrOhm: number, volume: number): Choice<CapacitorPart> | null {
  const start = lowerBound(list, minVoltageV, byVoltage);
  let best: CapacitorPart | null = null;
  let bestQty = 0;
  let bestCost = Infinity;
  for (let i = start; i < list.length; i++) {
    const c = list[i]!;
    const qty = Math.max(1, Math.ceil(minCapF / c.capacitanceF - 1e-9), Math.ceil(c.esrOhm / maxEsrOhm - 1e-9));
    if (qty > 20) continue;
    const cost = qty * unitPriceAt(c.tiers, volume);
    if (cost < bestCost) { best = c; bestQty = qty; bestCost = cost; }
  }
  return best ? { part: best, qty: bestQty } : null;
}

/** Smallest resistor family carrying `powerW` at ≤ 50 % of its rating and `voltageV`. */
export function selectResistor(list: ResistorPart[], powerW: number, voltageV: number): ResistorPart | null {
  for (let i = lowerBound(list, powerW / RESISTOR_POWER_DERATING, byPower); i < list.length; i++) {
    if (list[i]!.voltageV >= voltageV) return list[i]!;
  }
  return null;
}

/** Smallest inductor family storing `energyJ` (list sorted by energy, cheapest first by construction). */
export function selectInductor(list: InductorPart[], energyJ: number): InductorPart | null {
  return list[lowerBound(list, energyJ, byEnergy)] ?? null;
}

/**
 * Cheapest core among the three smallest whose Wa·Ae ≥ `minApM4` (area-product method,
 * McLyman ch. 7 [M]); `coreApM4` is the pre-computed Ap list in the same order.
 */
export function selectCore(coresByAp: CorePart[], coreApM4: Float64Array, minApM4: number, volume: number): CorePart | null {
  let lo = 0;
  let hi = coreApM4.length;
  while (lo < hi) { const mid = (lo + hi) >>> 1; if (coreApM4[mid]! < minApM4) lo = mid + 1; else hi = mid; }
  let best: CorePart | null = null;
  let bestCost = Infinity;
  for (let i = lo; i < coresByAp.length && i < lo + 3; i++) {
    const cost = unitPriceAt(coresByAp[i]!.tiers, volume);
    if (cost < bestCost) { best = coresByAp[i]!; bestCost = cost; }
  }
  return best;
}
