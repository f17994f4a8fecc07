import Papa from 'papaparse';
import type { Comparison } from '../engine';

/** Column names of the comparison CSV (one row per scheme), SI units as in the JSON contract. */
export const COMPARISON_CSV_COLUMNS = [
  'scheme', 'feasible', 'turnsRatio', 'dutyLimit', 'dutyAtVinMin', 'dutyAtVinNom', 'dutyAtVinMax', 'switchCount',
  'switchPeakV', 'switchStressV', 'switchRatingV', 'rectifierForwardV', 'rectifierFreewheelV', 'clampCapacitorV',
  'magnetizingPeakA', 'primaryRmsA', 'outputInductanceH', 'outputCapacitanceF', 'corePartId', 'turnsPrimary', 'deltaBT',
  'coreLossW', 'lossTotalW', 'efficiency', 'partCount', 'bomCost', 'score', 'failCodes',
] as const;

/** A spreadsheet would run a text cell starting with these as a formula; prefix it with '. */
export function guardCell(value: unknown): string {
  const text = value === null || value === undefined ? '' : typeof value === 'number' ? String(Number(value.toPrecision(6))) : String(value);
  return typeof value !== 'number' && /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

/** The comparison as CSV text, one row per scheme (papaparse does the quoting). */
export function comparisonCsv(c: Comparison): string {
  const rows = c.results.map((r) =>
    [r.scheme, r.feasible, r.turnsRatio, r.dutyLimit, r.duty.atVinMin, r.duty.atVinNom, r.duty.atVinMax,
      r.switchCount, r.switchPeakV, r.switchStressV, r.switchRatingV, r.rectifierReverseV.forward, r.rectifierReverseV.freewheel,
      r.clampCapacitorV, r.magnetizingPeakA, r.primaryRmsA, r.outputInductanceH, r.outputCapacitanceF, r.core.partId,
      r.core.turnsPrimary, r.core.deltaBT, r.core.coreLossW, r.lossesW.total, r.efficiency, r.partCount, r.bomCost, r.score,
      r.findings.filter((f) => f.severity === 'fail').map((f) => f.code).join(' ')].map(guardCell),
  );
  return `${Papa.unparse({ fields: [...COMPARISON_CSV_COLUMNS], data: rows }, { newline: '\n' })}\n`;
}
