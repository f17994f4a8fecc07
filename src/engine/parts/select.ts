import {
  CONDUCTION_BUDGET, CURRENT_DERATING, MAX_PARALLEL, RDS_HOT_FACTOR, RECTIFIER_CURRENT_MARGIN, RESISTOR_POWER_DERATING,
} from '../assumptions';
import type { CapacitorPart, CorePart, InductorPart, MosfetPart, RectifierPart, ResistorPart } from './types';

/**
 * Part selection on the sorted lists of a `LibraryIndex`. Every function returns the position of
 * the chosen part in its list (−1 when nothing fits) and leaves the number in parallel in
 * `picked.qty`; `prices` is the list's unit-price array from `pricesAt` (same order).
 * No objects are allocated: sweeps call these a few million times a second.
 */

/** Quantity in parallel of the last successful selection (selection is synchronous). */
export const picked = { qty: 0 };

/** Candidates scanned past the lower bound (keeps selection O(log n + small)). */
const SCAN = 8;
/** Largest capacitor bank considered. */
const MAX_CAP_BANK = 20;

function firstVds(list: readonly MosfetPart[], min: number): number {
  let lo = 0;
  let hi = list.length;
  while (lo < hi) { const mid = (lo + hi) >>> 1; if (list[mid]!.vdsV < min) lo = mid + 1; else hi = mid; }
  return lo;
}

function firstVrrm(list: readonly RectifierPart[], min: number): number {
  let lo = 0;
  let hi = list.length;
  while (lo < hi) { const mid = (lo + hi) >>> 1; if (list[mid]!.vrrmV < min) lo = mid + 1; else hi = mid; }
  return lo;
}

function firstVoltage(list: readonly CapacitorPart[], min: number): number {
  let lo = 0;
  let hi = list.length;
  while (lo < hi) { const mid = (lo + hi) >>> 1; if (list[mid]!.voltageV < min) lo = mid + 1; else hi = mid; }
  return lo;
}

/**
 * Cheapest MOSFET with Vds ≥ `minVdsV`, paralleled so that each part carries ≤ 0.6·ID
 * (MIL-DTL-917 Table XIX) and the position's hot conduction loss stays within 1 % of Pout
 * (common practice); if no part meets the budget, the lowest-loss bank of four. Only the lowest
 * voltage class that qualifies and the next are scanned.
 */
export function selectMosfet(list: readonly MosfetPart[], prices: Float64Array, minVdsV: number, irmsA: number, poutW: number): number {
  const start = firstVds(list, minVdsV);
  let best = -1;
  let bestQty = 0;
  let bestCost = Infinity;
  let fallback = -1;
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
      if (lossOne / MAX_PARALLEL < fallbackLoss) { fallback = i; fallbackLoss = lossOne / MAX_PARALLEL; }
      continue;
    }
    const cost = qty * prices[i]!;
    if (cost < bestCost) { best = i; bestQty = qty; bestCost = cost; }
  }
  if (best >= 0) { picked.qty = bestQty; return best; }
  picked.qty = MAX_PARALLEL;
  return fallback;
}

/**
 * Cheapest rectifier with VRRM ≥ `minVrrmV`, paralleled so the average current is at most
 * IF/1.5 (common practice).
 */
export function selectRectifier(list: readonly RectifierPart[], prices: Float64Array, minVrrmV: number, iavgA: number): number {
  const start = firstVrrm(list, minVrrmV);
  let best = -1;
  let bestQty = 0;
  let bestCost = Infinity;
  for (let i = start; i < list.length && i < start + SCAN; i++) {
    const qty = Math.max(1, Math.ceil((RECTIFIER_CURRENT_MARGIN * iavgA) / list[i]!.ifA));
    if (qty > MAX_PARALLEL) continue;
    const cost = qty * prices[i]!;
    if (cost < bestCost) { best = i; bestQty = qty; bestCost = cost; }
  }
  picked.qty = bestQty;
  return best;
}

/**
 * Cheapest capacitor bank with rating ≥ `minVoltageV` giving ≥ `minCapF` in total and, when
 * `maxEsrOhm` is finite, parallel ESR ≤ `maxEsrOhm` (qty up to 20; common practice).
 */
export function selectCapacitor(list: readonly CapacitorPart[], prices: Float64Array, minVoltageV: number, minCapF: number, maxEsrOhm: number): number {
  let best = -1;
  let bestQty = 0;
  let bestCost = Infinity;
  for (let i = firstVoltage(list, minVoltageV); i < list.length; i++) {
    const c = list[i]!;
    const qty = Math.max(1, Math.ceil(minCapF / c.capacitanceF - 1e-9), Math.ceil(c.esrOhm / maxEsrOhm - 1e-9));
    if (qty > MAX_CAP_BANK) continue;
    const cost = qty * prices[i]!;
    if (cost < bestCost) { best = i; bestQty = qty; bestCost = cost; }
  }
  picked.qty = bestQty;
  return best;
}

/** Smallest resistor family carrying `powerW` at ≤ 50 % of its rating and `voltageV` (common practice). */
export function selectResistor(list: readonly ResistorPart[], powerW: number, voltageV: number): number {
  const minW = powerW / RESISTOR_POWER_DERATING;
  let lo = 0;
  let hi = list.length;
  while (lo < hi) { const mid = (lo + hi) >>> 1; if (list[mid]!.powerW < minW) lo = mid + 1; else hi = mid; }
  for (let i = lo; i < list.length; i++) if (list[i]!.voltageV >= voltageV) return i;
  return -1;
}

/** Smallest inductor family storing `energyJ` (list sorted by energy, cheapest first by construction). */
export function selectInductor(list: readonly InductorPart[], energyJ: number): number {
  let lo = 0;
  let hi = list.length;
  while (lo < hi) { const mid = (lo + hi) >>> 1; if (list[mid]!.energyJ < energyJ) lo = mid + 1; else hi = mid; }
  return lo < list.length ? lo : -1;
}

/**
 * Cheapest core among the three smallest whose Wa·Ae ≥ `minApM4` (area-product method,
 * McLyman ch. 7 [M]); `coreApM4` is the pre-computed Ap list in the same order.
 */
export function selectCore(coresByAp: readonly CorePart[], coreApM4: Float64Array, prices: Float64Array, minApM4: number): number {
  let lo = 0;
  let hi = coreApM4.length;
  while (lo < hi) { const mid = (lo + hi) >>> 1; if (coreApM4[mid]! < minApM4) lo = mid + 1; else hi = mid; }
  let best = -1;
  let bestCost = Infinity;
  for (let i = lo; i < coresByAp.length && i < lo + 3; i++) {
    if (prices[i]! < bestCost) { best = i; bestCost = prices[i]!; }
  }
  return best;
}
