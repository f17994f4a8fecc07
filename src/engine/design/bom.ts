import { unitPriceAt } from '../parts/index-library';
import type { PriceTier } from '../parts/types';
import type { ResetSchemeModel } from '../schemes/types';
import type { Design } from './types';

/** Visitor over the power-stage parts of a design: role, part, quantity. */
export type PartVisitor = (role: string, part: { id: string; tiers: PriceTier[] }, qty: number) => void;

/** Visit every power-stage part of the design once (common order for BOM, cost and count). */
export function visitParts(d: Design, model: ResetSchemeModel, visit: PartVisitor): void {
  const ix = d.index;
  if (d.mainSwitch) visit('main-switch', d.mainSwitch, d.mainQty * model.seriesSwitches);
  if (d.auxSwitch) visit('clamp-switch', d.auxSwitch, 1);
  const low = ix.drivers['low-side'];
  const high = ix.drivers['bootstrap-high-side'];
  if (low && d.lowSideDrivers > 0) visit('gate-driver', low, d.lowSideDrivers);
  if (high && d.highSideDrivers > 0) visit('high-side-gate-driver', high, d.highSideDrivers);
  if (d.core) visit('transformer-core', d.core, 1);
  if (d.rectSr) {
    visit('forward-sync-rectifier', d.rectSr, d.rectQty);
    visit('freewheel-sync-rectifier', d.rectSr, d.rectQty);
    if (low) visit('sync-rectifier-driver', low, 1);
  } else if (d.rectDiode) {
    visit('forward-rectifier', d.rectDiode, d.rectQty);
    visit('freewheel-rectifier', d.rectDiode, d.rectQty);
  }
  if (d.inductor) visit('output-inductor', d.inductor, 1);
  if (d.outCap) visit('output-capacitor', d.outCap, d.outCapQty);
  if (d.clampDiode) visit(model.diodeRole, d.clampDiode, d.clampDiodeQty);
  if (d.clampCap) visit(model.capacitorRole, d.clampCap, d.clampCapQty);
  if (d.clampRes) visit('clamp-resistor', d.clampRes, 1);
  if (d.snubberDiode) visit('snubber-diode', d.snubberDiode, 1);
  if (d.snubberCap) visit('snubber-capacitor', d.snubberCap, 1);
  if (d.snubberRes) visit('snubber-resistor', d.snubberRes, 1);
}

/** Sum price × qty at the spec's annual volume, and count the parts (stored on the design). */
export function costAndCount(d: Design, model: ResetSchemeModel): void {
  acc.cost = 0;
  acc.count = 0;
  acc.volume = d.spec.annualVolume;
  visitParts(d, model, accumulate);
  d.bomCost = Math.round(acc.cost * 1000) / 1000;
  d.partCount = acc.count;
}

// Module-level accumulator: no closure per call in the hot path (evaluation is synchronous).
const acc = { cost: 0, count: 0, volume: 0 };
function accumulate(_role: string, part: { tiers: PriceTier[] }, qty: number): void {
  acc.cost += unitPriceAt(part.tiers, acc.volume) * qty;
  acc.count += qty;
}
