import { DUTY_MARGIN, RDS_HOT_FACTOR } from '../assumptions';
import type { Design } from '../design/types';
import { selectCapacitor, selectRectifier } from '../parts/select';

/** Design duty limit = min(controller limit, reset limit − margin) (margin: common practice). */
export function withMargin(resetLimit: number, maxDuty: number): number {
  return Math.min(maxDuty, resetLimit - DUTY_MARGIN);
}

/** Choose the reset/clamp diode(s) for a reverse voltage and average current; records a failure if none fits. */
export function chooseClampDiode(d: Design, reverseV: number, iavgA: number, qtyPerPosition: number): void {
  const c = selectRectifier(d.index.clampDiodes, reverseV / d.spec.voltageDerating, iavgA, d.spec.annualVolume);
  if (!c) { d.fails.push('no-clamp-part'); return; }
  d.clampDiode = c.part;
  d.clampDiodeQty = c.qty * qtyPerPosition;
}

/** Choose the clamp/resonant capacitor bank for a value and a working voltage. */
export function chooseClampCap(d: Design, capF: number, workingV: number): void {
  const c = selectCapacitor(d.index.capacitors, workingV / d.spec.voltageDerating, capF, Infinity, d.spec.annualVolume);
  if (!c) { d.fails.push('no-clamp-part'); return; }
  d.clampCap = c.part;
  d.clampCapQty = c.qty;
}

/** Hot on-resistance of a MOSFET bank (common practice factor 1.6 over 25 °C). */
export function hotRdsOhm(rdsOnOhm: number, qty: number): number {
  return (rdsOnOhm * RDS_HOT_FACTOR) / qty;
}

/** Diode forward drop, or 0 when no diode was chosen. */
export function vfOf(d: Design): number {
  return d.clampDiode ? d.clampDiode.vfV : 0;
}
