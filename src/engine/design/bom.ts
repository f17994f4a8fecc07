import type { ResetSchemeModel } from '../schemes/types';
import type { Design } from './types';

/** Visitor over the power-stage parts of a design: role, part, quantity and unit price at the spec's volume. */
export type PartVisitor = (role: string, part: { id: string }, qty: number, unitPrice: number) => void;

/** Visit every power-stage part of the design once (common order for BOM, cost and count). */
export function visitParts(d: Design, model: ResetSchemeModel, visit: PartVisitor): void {
  const ix = d.index;
  if (d.mainSwitch) visit('main-switch', d.mainSwitch, d.mainQty * model.seriesSwitches, d.mainPrice);
  if (d.auxSwitch) visit('clamp-switch', d.auxSwitch, 1, d.auxPrice);
  const low = ix.drivers['low-side'];
  const high = ix.drivers['bootstrap-high-side'];
  if (low && d.lowSideDrivers > 0) visit('gate-driver', low, d.lowSideDrivers, d.prices.lowSideDriver);
  if (high && d.highSideDrivers > 0) visit('high-side-gate-driver', high, d.highSideDrivers, d.prices.highSideDriver);
  if (d.core) visit('transformer-core', d.core, 1, d.corePrice);
  if (d.core && ix.winding) visit('transformer-windings', ix.winding, d.windingCount, d.windingPrice);
  if (d.rectSr) {
    visit('forward-sync-rectifier', d.rectSr, d.rectQty, d.rectPrice);
    visit('freewheel-sync-rectifier', d.rectSr, d.rectQty, d.rectPrice);
    if (low) visit('sync-rectifier-driver', low, 1, d.prices.lowSideDriver);
  } else if (d.rectDiode) {
    visit('forward-rectifier', d.rectDiode, d.rectQty, d.rectPrice);
    visit('freewheel-rectifier', d.rectDiode, d.rectQty, d.rectPrice);
  }
  if (d.inductor) visit('output-inductor', d.inductor, 1, d.inductorPrice);
  if (d.outCap) visit('output-capacitor', d.outCap, d.outCapQty, d.outCapPrice);
  if (d.clampDiode) visit(model.diodeRole, d.clampDiode, d.clampDiodeQty, d.clampDiodePrice);
  if (d.clampCap) visit(model.capacitorRole, d.clampCap, d.clampCapQty, d.clampCapPrice);
  if (d.clampRes) visit('clamp-resistor', d.clampRes, 1, d.clampResPrice);
  if (d.snubberDiode) visit('snubber-diode', d.snubberDiode, 1, d.snubberDiodePrice);
  if (d.snubberCap) visit('snubber-capacitor', d.snubberCap, 1, d.snubberCapPrice);
  if (d.snubberRes) visit('snubber-resistor', d.snubberRes, 1, d.snubberResPrice);
}

/** Sum price × qty at the spec's annual volume, and count the parts (stored on the design). */
export function costAndCount(d: Design, model: ResetSchemeModel): void {
  acc.cost = 0;
  acc.count = 0;
  visitParts(d, model, accumulate);
  // Windings are counted whether or not the library prices them (without a winding entry a finding says they are not costed).
  if (d.core && !d.index.winding) acc.count += d.windingCount;
  d.bomCost = Math.round(acc.cost * 1000) / 1000;
  d.partCount = acc.count;
}

// Module-level accumulator: no closure per call in the hot path (evaluation is synchronous).
const acc = { cost: 0, count: 0 };
function accumulate(_role: string, _part: unknown, qty: number, unitPrice: number): void {
  acc.cost += unitPrice * qty;
  acc.count += qty;
}
