import { memo, useEffect, useMemo, useRef, useState, type KeyboardEvent, type MouseEvent } from 'react';
import { Scatter } from 'react-chartjs-2';
import type { ChartData, ChartOptions, Chart as ChartType, Plugin } from 'chart.js';
import { Chart } from '../../components/charts/register';
import { SCHEME_LABELS } from '../../engine/scheme-ids';
import { SCHEME_STYLES } from '../../lib/scheme-style';
import { formatSi } from '../../lib/si';
import { nearestInCloud, newCloud, paintCloud, rgbOf, type CloudLayer, type PixelMap } from './cloud';
import type { SweepResult } from './pool';
import { pointAt, type DesignPoint } from './points';
import { F, STRIDE } from './run';
import { formatMoney } from '../../lib/format';

interface XY { x: number; y: number; i: number }
type Sc = ChartType<'scatter', XY[]>;

/** How long the fronts took to appear (epoch ms; chartMs is the chart's update and draw). */
export interface DrawTimes { committedAt: number; chartMs: number; paintedAt: number }
/** How long the cloud took: painting its slices (ms) and when the frame with it was painted (epoch ms). */
export interface CloudTimes { rasterMs: number; slices: number; paintedAt: number }

/** Points painted per task: a slice stays well under 50 ms of main-thread time. */
const SLICE = 25_000;

/** Runs `fn` in a new task (a message to ourselves is not clamped like a nested timeout). */
function nextTask(fn: () => void): void {
  const channel = new MessageChannel();
  channel.port1.onmessage = () => fn();
  channel.port2.postMessage(null);
}

interface Props {
  result: SweepResult | null;
  currency: string;
  onPick: (p: DesignPoint) => void;
  /** Called once the chart has painted a new result's axes and fronts. */
  onDrawn: (t: DrawTimes) => void;
  /** Called once the cloud of `result` has been painted (again after a resize). */
  onCloud: (result: SweepResult, t: CloudTimes) => void;
  /** What to say over the map when there is nothing to show: before the first run, during it, or when no point is feasible. */
  notice: 'empty' | 'running' | 'infeasible' | null;
}

function Notice({ kind }: { kind: NonNullable<Props['notice']> }) {
  if (kind === 'running') return <p className="rounded bg-panel/90 p-3 text-sm text-muted">Evaluating the design points…</p>;
  if (kind === 'infeasible') return <p className="max-w-md rounded bg-warn-soft p-3 text-center text-sm text-warn" data-no-feasible>No design point of this sweep is feasible. Widen the frequency range, allow more duty-limit steps, or vary the parts.</p>;
  return <p className="max-w-md rounded bg-panel/90 p-3 text-center text-sm text-muted" data-sweep-empty>Choose what to vary and run the sweep: every design point is evaluated in the browser on the engine's lean path, and the cost-versus-loss map appears here.</p>;
}

const now = (): number => performance.timeOrigin + performance.now();
const INK = '#1e2622';

/** Axis range around [lo, hi] with 4 % room each side (a single value gets ±5 %). */
function padded(lo: number, hi: number): { min: number; max: number } {
  const span = hi - lo || Math.abs(hi) * 0.1 || 1;
  return { min: Math.max(0, lo - 0.04 * span), max: hi + 0.04 * span };
}

/**
 * BOM cost against total loss. Every feasible point is painted as one bitmap under the chart (no
 * per-point chart objects); Chart.js draws the axes, each scheme's Pareto front and the overall front.
 * Hover, click and the keyboard (arrows along the fronts, Enter) find points in the full result.
 */
function SweepChart({ result, currency, onPick, onDrawn, onCloud, notice }: Props) {
  const chartRef = useRef<Sc>(null);
  const boxRef = useRef<HTMLDivElement>(null);
  const resultRef = useRef(result);
  resultRef.current = result;
  const layerRef = useRef<{ key: string; result: SweepResult; layer: CloudLayer; canvas: HTMLCanvasElement } | null>(null);
  const jobRef = useRef<{ key: string; result: SweepResult } | null>(null);
  const onCloudRef = useRef(onCloud);
  onCloudRef.current = onCloud;
  const drawRef = useRef({ start: 0, chartMs: 0 });
  const [hover, setHover] = useState<{ i: number; x: number; y: number } | null>(null);
  const [cursor, setCursor] = useState<{ front: number; pos: number } | null>(null);

  const fronts = useMemo((): number[][] => (result ? [result.overall, ...result.fronts] : []), [result]);
  const chartData = useMemo((): ChartData<'scatter', XY[]> => {
    if (!result) return { datasets: [] };
    const xy = (i: number): XY => ({ x: result.data[i * STRIDE + F.cost]!, y: result.data[i * STRIDE + F.lossW]!, i });
    return {
      datasets: [
        { label: 'Overall Pareto front', data: result.overall.map(xy), showLine: true, borderColor: INK, backgroundColor: INK, borderWidth: 2.5, pointRadius: 4.5, pointStyle: 'crossRot', order: 0 },
        ...result.plan.schemes.map((scheme, s) => {
          const st = SCHEME_STYLES[scheme];
          return { label: `${SCHEME_LABELS[scheme]} front`, data: result.fronts[s]!.map(xy), showLine: true, borderColor: st.color, backgroundColor: st.color, borderDash: st.dash, borderWidth: 1.75, pointRadius: 3, pointStyle: st.marker, order: 1 };
        }),
      ],
    };
  }, [result]);

  const options = useMemo((): ChartOptions<'scatter'> => {
    const has = result !== null && result.feasible > 0;
    const x = has ? padded(result.bounds.costMin, result.bounds.costMax) : { min: 0, max: 1 };
    const y = has ? padded(result.bounds.lossMin, result.bounds.lossMax) : { min: 0, max: 1 };
    return {
      animation: false, responsive: true, maintainAspectRatio: false, parsing: false, normalized: true, events: [],
      scales: {
        // Suggested, not fixed: Chart.js widens them to round tick values; the cloud reads the final scales.
        x: { type: 'linear', suggestedMin: x.min, suggestedMax: x.max, ticks: { display: has }, title: { display: true, text: `Power-stage BOM cost (${currency} per unit)` } },
        y: { type: 'linear', suggestedMin: y.min, suggestedMax: y.max, ticks: { display: has }, title: { display: true, text: 'Total loss at Vin,nom, full load (W)' } },
      },
      plugins: {
        tooltip: { enabled: false },
        legend: {
          display: has, position: 'bottom',
          labels: {
            usePointStyle: true, boxWidth: 8,
            generateLabels: (chart) => [
              ...Chart.defaults.plugins.legend.labels.generateLabels(chart),
              { text: 'Design points (dots in scheme colours, deeper where many overlap)', fillStyle: 'rgba(92, 103, 97, 0.45)', strokeStyle: 'rgba(92, 103, 97, 0.45)', lineWidth: 0, pointStyle: 'rect', hidden: false, datasetIndex: -1 },
            ],
          },
        },
      },
    };
  }, [result, currency]);

  /**
   * Paints the cloud of `r` in slices of SLICE points, one task each, then shows it: the fronts' frame
   * is never held up by the cloud, and no slice makes a long task.
   */
  const paintInSlices = (chart: Sc, r: SweepResult, key: string, map: PixelMap, width: number, height: number, dot: number): void => {
    const job = { key, result: r };
    jobRef.current = job;
    const colours = r.plan.schemes.map((s) => rgbOf(SCHEME_STYLES[s].color));
    let layer: CloudLayer | null = null;
    let from = 0, rasterMs = 0, slices = 0;
    const step = (): void => {
      if (jobRef.current !== job || chartRef.current !== chart) return; // superseded or unmounted
      const t0 = performance.now();
      layer ??= newCloud(r.count, width, height);
      const to = Math.min(r.count, from + SLICE);
      paintCloud(layer, r.data, from, to, colours, map, dot);
      from = to;
      slices++;
      if (from < r.count) {
        rasterMs += performance.now() - t0;
        nextTask(step);
        return;
      }
      const canvas = document.createElement('canvas');
      canvas.width = layer.width; canvas.height = layer.height;
      canvas.getContext('2d')!.putImageData(new ImageData(layer.pixels as Uint8ClampedArray<ArrayBuffer>, layer.width, layer.height), 0, 0);
      layerRef.current = { key, result: r, layer, canvas };
      jobRef.current = null;
      boxRef.current?.setAttribute('data-cloud-points', String(layer.drawn));
      chart.draw();
      rasterMs += performance.now() - t0;
      requestAnimationFrame(() => nextTask(() => onCloudRef.current(r, { rasterMs, slices, paintedAt: now() })));
    };
    nextTask(step);
  };

  const plugin = useMemo((): Plugin<'scatter'> => ({
    id: 'sweepCloud',
    beforeUpdate: () => { drawRef.current.start = performance.now(); },
    beforeDatasetsDraw: (chart) => {
      const r = resultRef.current;
      if (!r || r.feasible === 0) return;
      const { left, top, width, height } = chart.chartArea;
      const dpr = chart.currentDevicePixelRatio;
      const xs = chart.scales.x!, ys = chart.scales.y!;
      const key = [left, top, width, height, dpr, xs.min, xs.max, ys.min, ys.max].join();
      const ready = layerRef.current;
      // The finished picture of this result (stretched for a moment after a resize, until the new one is painted).
      if (ready && ready.result === r) chart.ctx.drawImage(ready.canvas, left, top, width, height);
      if ((ready && ready.result === r && ready.key === key) || (jobRef.current?.key === key && jobRef.current.result === r)) return;
      const map: PixelMap = {
        costAt0: xs.getValueForPixel(left)!, xPerCost: ((xs.getPixelForValue(xs.max) - xs.getPixelForValue(xs.min)) / (xs.max - xs.min)) * dpr,
        lossAt0: ys.getValueForPixel(top)!, yPerLoss: ((ys.getPixelForValue(ys.max) - ys.getPixelForValue(ys.min)) / (ys.max - ys.min)) * dpr,
      };
      paintInSlices(chart as Sc, r, key, map, width * dpr, height * dpr, Math.max(2, Math.round(2 * dpr)));
    },
    afterRender: () => { drawRef.current.chartMs = performance.now() - drawRef.current.start; },
  }), []);

  useEffect(() => {
    setHover(null);
    setCursor(null);
    if (!result) return;
    const committedAt = now();
    // After the frame with the new map is painted: a task queued from the next animation frame runs after it.
    let cancelled = false;
    const id = requestAnimationFrame(() => {
      const channel = new MessageChannel();
      channel.port1.onmessage = () => { if (!cancelled) onDrawn({ committedAt, chartMs: drawRef.current.chartMs, paintedAt: now() }); };
      channel.port2.postMessage(null);
    });
    return () => { cancelled = true; cancelAnimationFrame(id); };
  }, [result]);

  /** Plan index under a pointer position (CSS px in the canvas): front points first, then the cloud. */
  const pointNear = (x: number, y: number): number => {
    const chart = chartRef.current, layer = layerRef.current;
    if (!chart || !result) return -1;
    let best = -1, bestD = 64;
    for (const front of fronts) {
      for (const i of front) {
        const d = (chart.scales.x!.getPixelForValue(result.data[i * STRIDE + F.cost]!) - x) ** 2 + (chart.scales.y!.getPixelForValue(result.data[i * STRIDE + F.lossW]!) - y) ** 2;
        if (d < bestD) { bestD = d; best = i; }
      }
    }
    if (best >= 0 || !layer || layer.result !== result) return best;
    const dpr = chart.currentDevicePixelRatio;
    return nearestInCloud(layer.layer, (x - chart.chartArea.left) * dpr, (y - chart.chartArea.top) * dpr, 6 * dpr);
  };
  const placeOf = (i: number): { x: number; y: number } => {
    const chart = chartRef.current!;
    return { x: chart.scales.x!.getPixelForValue(result!.data[i * STRIDE + F.cost]!), y: chart.scales.y!.getPixelForValue(result!.data[i * STRIDE + F.lossW]!) };
  };
  const onMove = (e: MouseEvent<HTMLDivElement>): void => {
    const rect = e.currentTarget.getBoundingClientRect();
    const i = pointNear(e.clientX - rect.left, e.clientY - rect.top);
    setHover(i >= 0 ? { i, ...placeOf(i) } : null);
  };
  const onClick = (): void => { if (hover && result) onPick(pointAt(result.plan, result.data, hover.i)); };
  const onKey = (e: KeyboardEvent<HTMLDivElement>): void => {
    if (!result || result.overall.length === 0) return;
    const c = cursor ?? { front: 0, pos: 0 };
    let next = c;
    if (e.key === 'ArrowRight') next = { ...c, pos: Math.min(c.pos + 1, fronts[c.front]!.length - 1) };
    else if (e.key === 'ArrowLeft') next = { ...c, pos: Math.max(c.pos - 1, 0) };
    else if (e.key === 'ArrowDown' || e.key === 'ArrowUp') {
      const step = e.key === 'ArrowDown' ? 1 : -1;
      let f = c.front;
      do f = (f + step + fronts.length) % fronts.length; while (fronts[f]!.length === 0);
      next = { front: f, pos: Math.min(c.pos, fronts[f]!.length - 1) };
    } else if (e.key === 'Enter' || e.key === ' ') {
      onPick(pointAt(result.plan, result.data, fronts[c.front]![c.pos]!));
    } else if (e.key === 'Escape') { setCursor(null); setHover(null); return; } else return;
    e.preventDefault();
    setCursor(next);
    const i = fronts[next.front]![next.pos]!;
    setHover({ i, ...placeOf(i) });
  };

  const p = hover && result ? pointAt(result.plan, result.data, hover.i) : null;
  const onFront = p && cursor ? (cursor.front === 0 ? 'overall front' : `${SCHEME_LABELS[result!.plan.schemes[cursor.front - 1]!]} front`) : null;
  return (
    <div className="space-y-1">
      <div
        ref={boxRef} className="relative h-[30rem] rounded outline-offset-2 focus-visible:outline-2 focus-visible:outline-accent" data-sweep-chart
        tabIndex={result && result.overall.length > 0 ? 0 : -1} onMouseMove={onMove} onMouseLeave={() => { if (!cursor) setHover(null); }} onClick={onClick} onKeyDown={onKey}
        onFocus={() => { if (!cursor && result && result.overall.length > 0) { setCursor({ front: 0, pos: 0 }); setHover({ i: result.overall[0]!, ...placeOf(result.overall[0]!) }); } }}
        onBlur={() => { setCursor(null); setHover(null); }}
        role="img" aria-label="BOM cost against total loss for every feasible design point, with each scheme's Pareto front and the overall front"
        style={{ cursor: hover ? 'pointer' : 'default' }}
      >
        <Scatter ref={chartRef} data={chartData} options={options} plugins={[plugin]} updateMode="none" />
        {notice && <div className="pointer-events-none absolute inset-0 flex items-center justify-center p-8"><Notice kind={notice} /></div>}
        {hover && p && (
          <>
            <span className="pointer-events-none absolute size-3.5 -translate-x-1/2 -translate-y-1/2 rounded-full border-2 border-ink bg-white/40" style={{ left: hover.x, top: hover.y }} aria-hidden="true" data-sweep-ring />
            <div
              className="pointer-events-none absolute z-10 w-max max-w-[22rem] rounded bg-ink/95 px-2.5 py-2 text-xs leading-snug text-white shadow"
              style={{ left: hover.x, top: hover.y, transform: `translate(${hover.x > (chartRef.current?.width ?? 1000) * 0.6 ? 'calc(-100% - 12px)' : '12px'}, ${hover.y > (chartRef.current?.height ?? 480) * 0.55 ? 'calc(-100% - 8px)' : '8px'})` }}
              data-sweep-tooltip
            >
              <p className="font-semibold"><span className="mr-1 inline-block size-2 rounded-full" style={{ background: SCHEME_STYLES[p.scheme].color }} />{SCHEME_LABELS[p.scheme]} · {formatSi(p.fswHz, 'Hz')}{onFront && <span className="font-normal text-white/80"> · {onFront}</span>}</p>
              <p className="tabular-nums">BOM {p.cost.toFixed(2)} {currency} · loss {formatSi(p.lossW, 'W')} · η {(p.efficiency * 100).toFixed(1)} %</p>
              <p className="tabular-nums">duty limit {p.dutyLimit.toFixed(3)} · Ns/Np {p.turnsRatio.toFixed(3)}</p>
              <p>switch {p.mainSwitch ?? 'auto'} · rectifier {p.rectifier ?? 'auto'} · core {p.core ?? 'auto'}</p>
              <p className="mt-0.5 text-white/80">{cursor ? 'Enter' : 'Click'} to open this point in Compare</p>
            </div>
          </>
        )}
      </div>
      <p className="sr-only" aria-live="polite">{p ? `${SCHEME_LABELS[p.scheme]}, ${formatSi(p.fswHz, 'Hz')}, BOM ${formatMoney(p.cost, currency)}, loss ${formatSi(p.lossW, 'W')}${onFront ? `, on the ${onFront}` : ''}` : ''}</p>
    </div>
  );
}

/** Memoised: progress updates of the page leave the map alone. */
export default memo(SweepChart);
