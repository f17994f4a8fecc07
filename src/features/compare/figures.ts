import type { SchemeResult } from '../../engine';
import { formatMoney, formatPercent, formatSi, formatVolts } from '../../lib/format';

export interface Figure {
  label: string;
  /** Key into `result.trace` for the formula, inputs and source. */
  traceKey?: string;
  value(result: SchemeResult): string | null;
}

const v = (x: number | null | undefined, unit: string, digits = 3): string | null =>
  x === null || x === undefined || !Number.isFinite(x) ? null : unit === 'V' ? formatVolts(x, digits) : formatSi(x, unit, digits);
const duty = (x: number): string => formatPercent(x, 3);
/** A duty as a bare percentage number, one decimal: 0.3462 → "34.6". */
const pct = (x: number): string => (x * 100).toFixed(1);

/**
 * The three duties, or — where the output cannot be reached (a duty of 100 % or more, which the engine reports with
 * its reason in a finding) — "not reachable" instead of an impossible number.
 */
export function dutiesText(r: Pick<SchemeResult, 'duty'>): string {
  const { atVinMin, atVinNom, atVinMax } = r.duty;
  if (!(atVinMin < 1 && atVinNom < 1 && atVinMax < 1)) return `not reachable${atVinMax < 1 ? ` at Vin min${atVinNom < 1 ? '' : '/nom'}; ${pct(atVinMax)} % at Vin max` : ''}`;
  return `${pct(atVinMin)} / ${pct(atVinNom)} / ${pct(atVinMax)} %`;
}

/** The key figures on each scheme card, in reading order, each with its unit. */
export const FIGURES: Figure[] = [
  { label: 'Turns ratio Ns/Np', traceKey: 'turnsRatio', value: (r) => r.turnsRatio.toPrecision(3) },
  { label: 'Reset turns Nr/Np', value: (r) => (r.resetTurnsRatio === null ? null : r.resetTurnsRatio.toPrecision(3)) },
  { label: 'Duty limit', traceKey: 'dutyLimit', value: (r) => duty(r.dutyLimit) },
  { label: 'Duty at Vin min/nom/max', traceKey: 'duty.atVinMin', value: (r) => dutiesText(r) },
  { label: 'Switch peak (steady)', traceKey: 'switchPeakV', value: (r) => v(r.switchPeakV, 'V') },
  { label: 'Switch design stress', traceKey: 'switchStressV', value: (r) => v(r.switchStressV, 'V') },
  { label: 'Switch rating', traceKey: 'switchRatingV', value: (r) => (r.switchRatingV === null ? 'none fits' : `${r.switchRatingV.toFixed(0)} V${r.switchCount > 1 ? `, ${r.switchCount} switches` : ''}`) },
  { label: 'Clamp voltage', traceKey: 'clampCapacitorV', value: (r) => v(r.clampCapacitorV, 'V') },
  { label: 'Rectifier VR forward', traceKey: 'rectifierReverseV.forward', value: (r) => v(r.rectifierReverseV.forward, 'V') },
  { label: 'Rectifier VR freewheel', traceKey: 'rectifierReverseV.freewheel', value: (r) => v(r.rectifierReverseV.freewheel, 'V') },
  { label: 'Magnetizing peak', traceKey: 'magnetizingPeakA', value: (r) => v(r.magnetizingPeakA, 'A') },
  { label: 'Primary RMS', traceKey: 'primaryRmsA', value: (r) => v(r.primaryRmsA, 'A') },
  { label: 'Output L / C', traceKey: 'outputInductanceH', value: (r) => `${v(r.outputInductanceH, 'H', 2)} / ${v(r.outputCapacitanceF, 'F', 2)}` },
  { label: 'Core, Np, ΔB', traceKey: 'core.deltaBT', value: (r) => (r.core.partId ? `${r.core.partId.replace(/^demo-core-/, '').toUpperCase()}, ${r.core.turnsPrimary} t, ${v(r.core.deltaBT, 'T')}` : 'none fits') },
  { label: 'Core loss', traceKey: 'core.coreLossW', value: (r) => v(r.core.coreLossW, 'W') },
  { label: 'Reset / clamp loss', traceKey: 'lossesW.resetOrClamp', value: (r) => v(r.lossesW.resetOrClamp, 'W') },
  { label: 'Total losses', value: (r) => v(r.lossesW.total, 'W') },
  { label: 'Efficiency', traceKey: 'efficiency', value: (r) => formatPercent(r.efficiency, 3) },
  { label: 'Part count', value: (r) => `${r.partCount}` },
  { label: 'BOM cost', traceKey: 'bomCost', value: (r) => formatMoney(r.bomCost, r.currency) },
];
