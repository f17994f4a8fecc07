import { sweepVin, type Comparison, type PartsLibrary, type SchemeResult, type VinSweepPoint } from '../../../engine/index';
import { SCHEME_STYLES } from '../../../lib/scheme-style';
import { formatDuty, formatVolts } from '../../../lib/format';
import { markerDataset } from './markers';
import type { LegendEntry, LineDataset, LineSeries, XY } from './types';

/** Points per line sweep: smooth enough for the active clamp's curved Vin/(1−D), still cheap. */
export const SWEEP_POINTS = 41;
/** A marker every Nth sweep point; each scheme's markers are shifted so coincident lines stay identifiable. */
export const MARKER_EVERY = 8;
/** Dash of the thin reference lines (ratings, limits). */
export const REFERENCE_DASH = [1, 3];

/** The line sweep of one scheme, with the scheme's result. */
export interface SchemeSweep {
  result: SchemeResult;
  points: VinSweepPoint[];
}

/**
 * Sweeps every scheme of the comparison across Vin,min…Vin,max (engine `sweepVin`), with the parts library the
 * comparison was evaluated against, so the curves are the same designs as the cards.
 */
export function buildSweeps(comparison: Comparison, library: PartsLibrary, points = SWEEP_POINTS): SchemeSweep[] {
  return comparison.results.map((result) => ({ result, points: sweepVin(comparison.input, result.scheme, points, library) }));
}

/** Marker radius per point: `radius` on every `every`th point, shifted by `slot`, 0 elsewhere. */
export function markerRadii(count: number, slot: number, radius = 3.5, every = MARKER_EVERY): number[] {
  const offset = ((slot % every) + every) % every;
  const out = new Array<number>(count);
  for (let i = 0; i < count; i++) out[i] = (i - offset) % every === 0 ? radius : 0;
  return out;
}

/** The marker slot of the k-th scheme: spreads up to five schemes over the MARKER_EVERY positions. */
export function markerSlot(k: number): number {
  return Math.round((k * MARKER_EVERY) / 5) % MARKER_EVERY;
}

/** Scheme name as shown on charts, flagging schemes the engine found not feasible. */
export function schemeLabel(result: SchemeResult): string {
  return result.feasible ? result.label : `${result.label} (not feasible)`;
}

function curve(sweep: SchemeSweep, pick: (p: VinSweepPoint) => number): LineDataset {
  const style = SCHEME_STYLES[sweep.result.scheme];
  const data: XY[] = sweep.points.map((p) => ({ x: p.vinV, y: pick(p) }));
  return {
    type: 'line', scheme: sweep.result.scheme, kind: 'value', label: schemeLabel(sweep.result), data,
    borderColor: style.color, backgroundColor: style.color, borderDash: style.dash, borderWidth: 2,
    pointStyle: style.marker, pointRadius: 0, pointHoverRadius: 4, pointBackgroundColor: style.color,
    pointBorderColor: style.color, pointHitRadius: 6, tension: 0, order: 1,
  };
}

/** Staggered markers of each scheme's curve (see MARKER_EVERY). */
function sweepMarkers(lines: LineDataset[]): LineDataset[] {
  return lines.map((line, k) => markerDataset(line, markerRadii(line.data.length, markerSlot(k))));
}

function reference(sweep: SchemeSweep, value: number, label: string): LineDataset {
  const style = SCHEME_STYLES[sweep.result.scheme];
  const first = sweep.points[0]?.vinV ?? 0;
  const last = sweep.points[sweep.points.length - 1]?.vinV ?? first;
  return {
    type: 'line', scheme: sweep.result.scheme, kind: 'limit', label, data: [{ x: first, y: value }, { x: last, y: value }],
    borderColor: style.color, backgroundColor: style.color, borderDash: REFERENCE_DASH, borderWidth: 1,
    pointStyle: style.marker, pointRadius: [0, 3], pointHoverRadius: 0, pointHitRadius: 0,
    pointBackgroundColor: '#ffffff', pointBorderColor: style.color, tension: 0, order: 2,
  };
}

function legendEntry(sweep: SchemeSweep, detail: string): LegendEntry {
  const style = SCHEME_STYLES[sweep.result.scheme];
  return { key: sweep.result.scheme, label: schemeLabel(sweep.result), detail, color: style.color, dash: style.dash, marker: style.marker };
}

function ranges(sweeps: SchemeSweep[], ys: number[]): Pick<LineSeries, 'xMin' | 'xMax'> & { top: number } {
  const first = sweeps[0]?.points;
  const xMin = first?.[0]?.vinV ?? 0;
  const xMax = first?.[first.length - 1]?.vinV ?? 1;
  const finite = ys.filter(Number.isFinite);
  return { xMin, xMax, top: finite.length ? Math.max(...finite) : 1 };
}

/**
 * Main switch off-state voltage (steady state, no leakage spike) against Vin for every scheme,
 * plus each scheme's chosen voltage rating as a thin dotted line. For two-switch this is the
 * voltage across each of the two switches.
 */
export function buildStressSeries(sweeps: SchemeSweep[]): LineSeries {
  const lines = sweeps.map((s) => curve(s, (p) => p.switchV));
  const references: LineDataset[] = [];
  const legend: LegendEntry[] = [];
  const ys: number[] = [];
  for (const s of sweeps) {
    const rating = s.result.switchRatingV;
    if (rating !== null && Number.isFinite(rating)) {
      references.push(reference(s, rating, `${s.result.label} rating`));
      ys.push(rating);
    }
    for (const p of s.points) ys.push(p.switchV);
    legend.push(legendEntry(s, rating === null ? 'no rating chosen' : `rating ${formatVolts(rating)}`));
  }
  const r = ranges(sweeps, ys);
  return { lines, markers: sweepMarkers(lines), references, legend, yMin: 0, yMax: r.top * 1.06, xMin: r.xMin, xMax: r.xMax };
}

/** Duty D = K/Vin against Vin for every scheme, with each scheme's duty limit as a thin dotted line. */
export function buildDutySeries(sweeps: SchemeSweep[]): LineSeries {
  const lines = sweeps.map((s) => curve(s, (p) => p.duty));
  const references = sweeps.map((s) => reference(s, s.result.dutyLimit, `${s.result.label} duty limit`));
  const legend = sweeps.map((s) => legendEntry(s, `limit ${formatDuty(s.result.dutyLimit)}`));
  const ys = sweeps.flatMap((s) => [s.result.dutyLimit, ...s.points.map((p) => p.duty)]);
  const r = ranges(sweeps, ys);
  // Whole tenths of duty, never above 100 %.
  return { lines, markers: sweepMarkers(lines), references, legend, yMin: 0, yMax: Math.min(1, Math.ceil((r.top + 0.02) * 10) / 10), xMin: r.xMin, xMax: r.xMax };
}
