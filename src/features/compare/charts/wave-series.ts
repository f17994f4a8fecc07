import { waveforms, type Comparison, type PartsLibrary, type SchemeId, type WavePoint } from '../../../engine/index';
import { SCHEME_STYLES } from '../../../lib/scheme-style';
import { INK, NEUTRAL } from './palette';
import { REFERENCE_DASH } from './sweep-series';
import { markerDataset } from './markers';
import type { LegendEntry, LineDataset, LineSeries, XY } from './types';

/** The four waveform panels of one scheme at Vin,nom, full load; time in µs. */
export interface WaveSeries {
  scheme: SchemeId;
  /** Main switches in series: the drain trace is the voltage across each (from the engine's waveforms). */
  seriesSwitches: number;
  vinV: number;
  periodUs: number;
  drain: LineSeries;
  currents: LineSeries;
  secondary: LineSeries;
  inductor: LineSeries;
}

const toXY = (points: WavePoint[]): XY[] => points.map((p) => ({ x: p.tS * 1e6, y: p.value }));

/** Direction change (degrees) above which a waveform sample counts as a corner and gets a marker. */
const CORNER_DEG = 50;

/**
 * Marker radius per sample: a marker on each corner of the piecewise-linear trace (ends, edges,
 * peaks), none along sampled arcs, so resonant traces do not turn into a string of beads.
 * Angles are measured with both axes scaled to the panel's data range.
 */
export function cornerRadii(data: XY[], radius = 2.5): number[] {
  const xs = data.map((p) => p.x);
  const ys = data.map((p) => p.y);
  const sx = Math.max(...xs) - Math.min(...xs) || 1;
  const sy = Math.max(...ys) - Math.min(...ys) || 1;
  const same = (a: XY, b: XY) => Math.abs(a.x - b.x) / sx < 1e-9 && Math.abs(a.y - b.y) / sy < 1e-9;
  return data.map((p, i) => {
    if (i > 0 && same(p, data[i - 1]!)) return 0; // repeated sample: one marker is enough
    let a = i - 1;
    while (a >= 0 && same(data[a]!, p)) a--;
    let b = i + 1;
    while (b < data.length && same(data[b]!, p)) b++;
    if (a < 0 || b >= data.length) return radius;
    const [u, v] = [data[a]!, data[b]!];
    const d1 = Math.atan2((p.y - u.y) / sy, (p.x - u.x) / sx);
    const d2 = Math.atan2((v.y - p.y) / sy, (v.x - p.x) / sx);
    let turn = Math.abs(d2 - d1) * (180 / Math.PI);
    if (turn > 180) turn = 360 - turn;
    return turn > CORNER_DEG ? radius : 0;
  });
}

/** Corner markers for the curves that have a point style. */
function cornerMarkers(lines: LineDataset[]): LineDataset[] {
  return lines.filter((l) => l.pointStyle).map((l) => markerDataset(l, cornerRadii(l.data)));
}

function trace(scheme: SchemeId | null, label: string, data: XY[], color: string, dash: number[], marker: LegendEntry['marker']): LineDataset {
  return {
    type: 'line', scheme, kind: 'value', label, data, borderColor: color, backgroundColor: color, borderDash: dash,
    borderWidth: 2, pointStyle: marker === 'none' ? false : marker, pointRadius: 0,
    pointHoverRadius: 4, pointBackgroundColor: color, pointBorderColor: color, pointHitRadius: 5, tension: 0, order: 1,
  };
}

/** y range: 'zero' keeps 0 in view, 'symmetric' centres 0, 'tight' hugs the data (ripple shows). */
type YFit = 'zero' | 'symmetric' | 'tight';

function series(lines: LineDataset[], references: LineDataset[], legend: LegendEntry[], periodUs: number, fit: YFit = 'zero'): LineSeries {
  const ys = [...lines, ...references].flatMap((d) => d.data.map((p) => p.y)).filter(Number.isFinite);
  let lo = ys.length ? Math.min(...ys) : 0;
  let hi = ys.length ? Math.max(...ys) : 1;
  if (fit === 'zero') [lo, hi] = [Math.min(0, lo), Math.max(0, hi)];
  if (fit === 'symmetric') [lo, hi] = [-Math.max(hi, -lo), Math.max(hi, -lo)];
  const pad = (hi - lo || Math.abs(hi) || 1) * 0.08;
  return { lines, markers: cornerMarkers(lines), references, legend, yMin: fit === 'zero' && lo === 0 ? 0 : lo - pad, yMax: hi + pad, xMin: 0, xMax: 2 * periodUs };
}

/** Share of the current panel's height kept below zero, so a bipolar magnetizing current shows. */
const BELOW_ZERO = 0.3;

/**
 * Primary current on the left axis and magnetizing current on its own right axis, zeros aligned:
 * at full load the magnetizing current is a few per cent of the primary current and would
 * otherwise hug the zero line, hiding how each scheme resets it (unipolar or bipolar).
 */
function currentSeries(primary: LineDataset, magnetizing: LineDataset, legend: LegendEntry[], periodUs: number): LineSeries {
  const ip = primary.data.map((p) => p.y).filter(Number.isFinite);
  const im = magnetizing.data.map((p) => Math.abs(p.y)).filter(Number.isFinite);
  const top = Math.max(1e-9, ...ip) * 1.08;
  const bottom = -Math.max((top * BELOW_ZERO) / (1 - BELOW_ZERO), -Math.min(0, ...ip) * 1.08);
  const m = Math.max(1e-9, ...im) * 1.1;
  const scale = m / -bottom;
  return {
    lines: [primary, magnetizing], markers: cornerMarkers([primary, magnetizing]), references: [], legend, yMin: bottom, yMax: top, xMin: 0, xMax: 2 * periodUs,
    y2: { min: bottom * scale, max: top * scale, title: 'Magnetizing current (A)' },
  };
}

/** Engine waveforms of one scheme (two switching periods at Vin,nom), designed with the comparison's parts library, shaped for the four charts. */
export function buildWaveSeries(comparison: Comparison, scheme: SchemeId, library: PartsLibrary): WaveSeries {
  const w = waveforms(comparison.input, scheme, undefined, library);
  const style = SCHEME_STYLES[scheme];
  const periodUs = w.periodS * 1e6;
  const own = (label: string, points: WavePoint[]) => trace(scheme, label, toXY(points), style.color, [], style.marker);
  const entry = (label: string, color: string, dash: number[], marker: LegendEntry['marker'], thin = false): LegendEntry => ({ key: label, label, color, dash, marker, thin });
  const vinLine: LineDataset = {
    type: 'line', scheme: null, kind: 'limit', label: 'Vin', data: [{ x: 0, y: w.vinV }, { x: 2 * periodUs, y: w.vinV }],
    borderColor: NEUTRAL, borderDash: REFERENCE_DASH, borderWidth: 1.5, pointRadius: 0, pointHitRadius: 0, tension: 0, order: 2,
  };
  const drainLabel = w.seriesSwitches > 1 ? 'v_DS of each switch' : 'Main switch v_DS';
  const magnetizing: LineDataset = { ...trace(scheme, 'Magnetizing current', toXY(w.magnetizingA), INK, [5, 3], 'none'), yAxisID: 'y2' };
  return {
    scheme,
    seriesSwitches: w.seriesSwitches,
    vinV: w.vinV,
    periodUs,
    drain: series([own(drainLabel, w.drainV)], [vinLine], [entry(drainLabel, style.color, [], style.marker), entry(`Input voltage ${Number(w.vinV.toPrecision(3))} V`, NEUTRAL, REFERENCE_DASH, 'none', true)], periodUs),
    currents: currentSeries(own('Primary current', w.primaryA), magnetizing, [entry('Primary current (left axis)', style.color, [], style.marker), entry('Magnetizing current (right axis)', INK, [5, 3], 'none')], periodUs),
    secondary: series([own('Secondary winding voltage', w.secondaryV)], [], [entry('Secondary winding voltage', style.color, [], style.marker)], periodUs, 'symmetric'),
    inductor: series([own('Output inductor current', w.inductorA)], [], [entry('Output inductor current', style.color, [], style.marker)], periodUs, 'tight'),
  };
}
