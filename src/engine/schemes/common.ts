import { DUTY_MARGIN, RDS_HOT_FACTOR } from '../assumptions';
import type { Design } from '../design/types';
import { picked, selectCapacitor, selectRectifier } from '../parts/select';

/** Design duty limit = min(controller limit, reset limit − margin) (margin: common practice). */
export function withMargin(resetLimit: number, maxDuty: number): number {
  return Math.min(maxDuty, resetLimit - DUTY_MARGIN);
}

/** Choose the reset/clamp diode(s) for a reverse voltage and average current; records a failure if none fits. */
export function chooseClampDiode(d: Design, reverseV: number, iavgA: number, qtyPerPosition: number): void {
  const i = selectRectifier(d.index.clampDiodes, d.prices.clampDiodes, reverseV / d.spec.voltageDerating, iavgA);
  if (i < 0) { d.fails.push('no-clamp-part'); return; }
  d.clampDiode = d.index.clampDiodes[i]!;
  d.clampDiodeQty = picked.qty * qtyPerPosition;
  d.clampDiodePrice = d.prices.clampDiodes[i]!;
}

/** Choose the clamp/resonant capacitor bank for a value and a working voltage. */
export function chooseClampCap(d: Design, capF: number, workingV: number): void {
  const i = selectCapacitor(d.index.capacitors, d.prices.capacitors, workingV / d.spec.voltageDerating, capF, Infinity);
  if (i < 0) { d.fails.push('no-clamp-part'); return; }
  d.clampCap = d.index.capacitors[i]!;
  d.clampCapQty = picked.qty;
  d.clampCapPrice = d.prices.capacitors[i]!;
}

/** Hot on-resistance of a MOSFET bank (common practice factor 1.6 over 25 °C). */
export function hotRdsOhm(rdsOnOhm: number, qty: number): number {
  return (rdsOnOhm * RDS_HOT_FACTOR) / qty;
}

/** Diode forward drop, or 0 when no diode was chosen. */
export function vfOf(d: Design): number {
  return d.clampDiode ? d.clampDiode.vfV : 0;
}
