import { lazy, Suspense, useCallback, useDeferredValue, useEffect, useMemo, useRef, useState } from 'react';
import { SCHEME_IDS, SCHEME_LABELS, type NormalisedSpec, type PartsLibrary, type SchemeId } from '../../engine';
import { SCHEME_STYLES } from '../../lib/scheme-style';
import { formatSi } from '../../lib/si';
import { handoffHref } from '../../stores/sweep-handoff';
import { DEFAULT_SETTINGS, planSweep, settingsProblems, type SweepSettings } from './plan';
import { overrideOf, pointAt, type DesignPoint } from './points';
import { SweepPool, type SweepResult } from './pool';
import type { CloudTimes, DrawTimes } from './SweepChart';

// Chart.js loads and the empty map is built while the user sets up, so the first result only updates it.
const loadChart = (): Promise<typeof import('./SweepChart')> => import('./SweepChart');
const SweepChart = lazy(loadChart);

interface Props {
  specId: string;
  spec: NormalisedSpec;
  library: PartsLibrary;
}

type Status = { kind: 'idle' } | { kind: 'running'; done: number; total: number } | { kind: 'cancelled'; done: number; total: number } | { kind: 'error'; message: string } | { kind: 'done' };

/** Figures of the last run, milliseconds from the Run click (also exposed to the browser test). */
export interface SweepTiming { points: number; workers: number; evaluateMs: number; workerMs: number; totalMs: number; cloudMs: number | null }

/** Where the last run's time went, milliseconds (exposed to the browser test as `__sweepBreakdown`). */
export interface SweepBreakdown {
  workers: number;
  /** Each worker's start-up warm-up when the page loaded (not part of a run). */
  warmMs: number[];
  /** Per worker: Run click → job received, evaluation, its fronts and extent, hand-over to the page. */
  dispatchMs: number[];
  evaluateMs: number[];
  frontsMs: number[];
  transferMs: number[];
  /** Last part in → numbers in plan order and fronts joined. */
  mergeMs: number;
  /** Joined → React committed, including the chart's update and draw (axes and fronts). */
  renderMs: number;
  /** Of which: the chart's update and draw. */
  chartMs: number;
  /** Committed → frame with the fronts painted. */
  paintMs: number;
  /** Run click → fronts painted (the goal's figure). */
  totalMs: number;
  /** The cloud, painted after the fronts: main-thread time painting it, in how many tasks, and Run click → frame with it painted. */
  rasterMs: number | null;
  slices: number | null;
  cloudMs: number | null;
}

const now = (): number => performance.timeOrigin + performance.now();

function breakdownOf(r: SweepResult, d: DrawTimes, warmMs: number[]): SweepBreakdown {
  const { startedAt, parts, mergedAt } = r.times;
  const lastIn = Math.max(...parts.map((p) => p.arrivedAt));
  return {
    workers: parts.length, warmMs,
    dispatchMs: parts.map((p) => p.receivedAt - startedAt), evaluateMs: parts.map((p) => p.evaluatedAt - p.receivedAt),
    frontsMs: parts.map((p) => p.summarisedAt - p.evaluatedAt), transferMs: parts.map((p) => p.arrivedAt - p.summarisedAt),
    mergeMs: mergedAt - lastIn, renderMs: d.committedAt - mergedAt, chartMs: d.chartMs,
    paintMs: d.paintedAt - d.committedAt, totalMs: d.paintedAt - startedAt, rasterMs: null, slices: null, cloudMs: null,
  };
}

/** The Sweep island: settings, a run on warm workers with progress and cancel, the cost-versus-loss map and the overall front as a table. */
export default function SweepScreen({ specId, spec, library }: Props) {
  const [settings, setSettings] = useState<SweepSettings>({ ...DEFAULT_SETTINGS, schemes: [...spec.schemes] });
  const [status, setStatus] = useState<Status>({ kind: 'idle' });
  const [result, setResult] = useState<SweepResult | null>(null);
  const [timing, setTiming] = useState<SweepTiming | null>(null);
  // The front table renders after the map, in React's background pass, so it never lengthens the map's frame.
  const tableResult = useDeferredValue(result);
  const pool = useRef<SweepPool | null>(null);
  const problems = settingsProblems(settings);
  const plan = useMemo(() => (problems.length === 0 ? planSweep(spec, library, settings) : null), [settings]);
  const estimate = plan?.total ?? 0;
  useEffect(() => {
    pool.current = new SweepPool(spec, library);
    void loadChart();
    return () => pool.current?.dispose();
  }, []);

  const run = (): void => {
    if (!plan || !pool.current) return;
    const startedAt = now();
    setStatus({ kind: 'running', done: 0, total: plan.total });
    setTiming(null);
    pool.current.run(plan, startedAt, {
      progress: (done, total) => setStatus({ kind: 'running', done, total }),
      done: (r) => { setResult(r); setStatus({ kind: 'done' }); },
      error: (message) => setStatus({ kind: 'error', message }),
    });
  };
  const cancel = (): void => {
    pool.current?.cancel();
    setStatus((s) => (s.kind === 'running' ? { kind: 'cancelled', done: s.done, total: s.total } : s));
  };
  // Stable callbacks, so the memoised map does not re-render on progress updates.
  const resultRef = useRef(result);
  resultRef.current = result;
  const drawn = useCallback((d: DrawTimes): void => {
    const r = resultRef.current;
    if (!r) return;
    const b = breakdownOf(r, d, pool.current?.warmMs ?? []);
    const { startedAt, parts } = r.times;
    const t: SweepTiming = {
      points: r.count, workers: parts.length, evaluateMs: Math.max(...parts.map((p) => p.evaluatedAt)) - startedAt,
      workerMs: Math.max(...parts.map((p) => p.summarisedAt)) - startedAt, totalMs: b.totalMs, cloudMs: null,
    };
    setTiming(t);
    Object.assign(window, { __sweepTiming: t, __sweepBreakdown: b });
  }, []);
  const cloudDrawn = useCallback((r: SweepResult, c: CloudTimes): void => {
    const w = window as unknown as { __sweepBreakdown?: SweepBreakdown; __sweepCloud?: SweepResult };
    // Only the first picture of the current run counts (a resize paints it again).
    if (r !== resultRef.current || w.__sweepCloud === r) return;
    w.__sweepCloud = r;
    const cloudMs = c.paintedAt - r.times.startedAt;
    if (w.__sweepBreakdown) Object.assign(w.__sweepBreakdown, { rasterMs: c.rasterMs, slices: c.slices, cloudMs });
    setTiming((t) => (t ? { ...t, cloudMs } : t));
  }, []);
  const pick = useCallback((p: DesignPoint): void => window.location.assign(handoffHref(specId, p.scheme, overrideOf(p), p.fswHz === spec.fswHz ? null : p.fswHz)), [specId, spec.fswHz]);
  const set = <K extends keyof SweepSettings>(key: K, value: SweepSettings[K]): void => setSettings((s) => ({ ...s, [key]: value }));
  const toggleScheme = (id: SchemeId): void => set('schemes', settings.schemes.includes(id) ? settings.schemes.filter((s) => s !== id) : SCHEME_IDS.filter((s) => s === id || settings.schemes.includes(s)));
  const running = status.kind === 'running';
  const currency = library.currency;

  return (
    <div className="space-y-4" data-sweep data-status={status.kind}>
      <form className="card space-y-3 p-4" onSubmit={(e) => { e.preventDefault(); run(); }} aria-label="Sweep settings">
        <fieldset>
          <legend className="label">Reset schemes</legend>
          <div className="mt-1 flex flex-wrap gap-3">
            {SCHEME_IDS.map((id) => (
              <label key={id} className="flex items-center gap-1.5 text-sm">
                <input type="checkbox" checked={settings.schemes.includes(id)} onChange={() => toggleScheme(id)} disabled={running} />
                <span className="inline-block size-2.5 rounded-full" style={{ background: SCHEME_STYLES[id].color }} aria-hidden="true" />
                {SCHEME_LABELS[id]}
              </label>
            ))}
          </div>
        </fieldset>
        <div className="grid gap-3 sm:grid-cols-4">
          <label className="text-sm"><span className="label">Lowest frequency (kHz)</span>
            <input className="field w-full" type="number" min={10} max={5000} step="any" value={settings.fswMinHz / 1e3} disabled={running} onChange={(e) => set('fswMinHz', Number(e.target.value) * 1e3)} /></label>
          <label className="text-sm"><span className="label">Highest frequency (kHz)</span>
            <input className="field w-full" type="number" min={10} max={5000} step="any" value={settings.fswMaxHz / 1e3} disabled={running} onChange={(e) => set('fswMaxHz', Number(e.target.value) * 1e3)} /></label>
          <label className="text-sm"><span className="label">Frequency steps (log-spaced)</span>
            <input className="field w-full" type="number" min={1} max={40} value={settings.fswSteps} disabled={running} onChange={(e) => set('fswSteps', Number(e.target.value))} /></label>
          <label className="text-sm"><span className="label">Duty-limit steps (60–100 % of each scheme's limit)</span>
            <input className="field w-full" type="number" min={1} max={20} value={settings.dutySteps} disabled={running} onChange={(e) => set('dutySteps', Number(e.target.value))} /></label>
        </div>
        <fieldset className="flex flex-wrap gap-4 text-sm">
          <legend className="label">Vary parts from the library (otherwise the engine picks the cheapest that fits)</legend>
          <label className="flex items-center gap-1.5"><input type="checkbox" checked={settings.varyMainSwitch} disabled={running} onChange={(e) => set('varyMainSwitch', e.target.checked)} /> Main switch</label>
          <label className="flex items-center gap-1.5"><input type="checkbox" checked={settings.varyRectifier} disabled={running} onChange={(e) => set('varyRectifier', e.target.checked)} /> {spec.rectifier === 'synchronous' ? 'Synchronous rectifier' : 'Rectifier diode'}</label>
          <label className="flex items-center gap-1.5"><input type="checkbox" checked={settings.varyCore} disabled={running} onChange={(e) => set('varyCore', e.target.checked)} /> Core</label>
        </fieldset>
        {problems.length > 0 && <ul className="text-sm text-fail" role="alert">{problems.map((p) => <li key={p}>{p}</li>)}</ul>}
        <div className="flex flex-wrap items-center gap-3">
          <button type="submit" className="btn btn-primary" disabled={running || problems.length > 0} data-run-sweep>Run sweep</button>
          <button type="button" className="btn" onClick={cancel} disabled={!running} data-cancel-sweep>Cancel</button>
          <span className="text-sm text-muted" data-estimate={estimate}>{estimate.toLocaleString('en')} design points</span>
        </div>
        <div aria-live="polite" className="text-sm">
          {status.kind === 'running' && (
            <div className="flex items-center gap-2">
              <progress className="h-2 w-64" max={status.total || 1} value={status.done} aria-label="Sweep progress" data-progress />
              <span className="tabular-nums">{status.done.toLocaleString('en')} of {status.total.toLocaleString('en')} points</span>
            </div>
          )}
          {status.kind === 'cancelled' && <p data-cancelled>Cancelled after {status.done.toLocaleString('en')} of {status.total.toLocaleString('en')} points; the map below is from the previous run, if any.</p>}
          {status.kind === 'error' && <p className="text-fail" role="alert">The sweep failed: {status.message}</p>}
        </div>
      </form>

      <section className="card space-y-3 p-4" aria-labelledby="sweep-map-title" data-sweep-result data-points={result?.count ?? 0}>
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="sweep-map-title" className="font-semibold">Cost against loss</h2>
          {result && (
            <p className="text-sm text-muted" data-sweep-figures>
              {result.count.toLocaleString('en')} points, {result.feasible.toLocaleString('en')} feasible
              {timing && <> · evaluated in {timing.evaluateMs.toFixed(0)} ms on {timing.workers} {timing.workers === 1 ? 'worker' : 'workers'} ({Math.round(result.count / (timing.evaluateMs / 1000)).toLocaleString('en')} points/s), fronts drawn {timing.totalMs.toFixed(0)} ms after Run{timing.cloudMs !== null && <>, every point {timing.cloudMs.toFixed(0)} ms</>}</>}
            </p>
          )}
        </div>
        <Suspense fallback={<p className="flex h-[30rem] items-center justify-center text-sm text-muted">Loading the chart…</p>}>
          <SweepChart result={result} currency={currency} onPick={pick} onDrawn={drawn} onCloud={cloudDrawn} notice={!result ? (status.kind === 'running' ? 'running' : 'empty') : result.feasible === 0 ? 'infeasible' : null} />
        </Suspense>
        <p className="text-xs text-muted">Each dot is one feasible design point in its scheme's colour, all of them drawn (the colour deepens where many overlap); lines are each scheme's Pareto front, the dark line with crosses the overall front. Hover a point for its design; click it to open Compare with it applied. From the keyboard, focus the map: ← → step along a front, ↑ ↓ change front, Enter opens the point. Losses at nominal input and full load; cost at the set's annual volume.</p>
        {tableResult && tableResult.overall.length > 0 && <FrontTable result={tableResult} specId={specId} fswHz={spec.fswHz} currency={currency} />}
      </section>
    </div>
  );
}

function FrontTable({ result, specId, fswHz, currency }: { result: SweepResult; specId: string; fswHz: number; currency: string }) {
  return (
    <div className="overflow-x-auto">
      <table className="table-eng w-full text-sm" data-front-table>
        <caption className="text-left font-semibold">Overall Pareto front ({result.overall.length} points, cheapest first)</caption>
        <thead><tr><th>Scheme</th><th>BOM cost</th><th>Total loss</th><th>Efficiency</th><th>Frequency</th><th>Duty limit</th><th>Turns ratio</th><th>Main switch</th><th>Rectifier</th><th>Core</th><th><span className="sr-only">Open</span></th></tr></thead>
        <tbody>
          {result.overall.map((i) => {
            const p = pointAt(result.plan, result.data, i);
            return (
              <tr key={i} data-front-row={p.scheme}>
                <td><span className="mr-1 inline-block size-2 rounded-full" style={{ background: SCHEME_STYLES[p.scheme].color }} aria-hidden="true" />{SCHEME_LABELS[p.scheme]}</td>
                <td className="tabular-nums">{p.cost.toFixed(2)} {currency}</td>
                <td className="tabular-nums">{p.lossW.toFixed(2)} W</td>
                <td className="tabular-nums">{(p.efficiency * 100).toFixed(1)} %</td>
                <td className="tabular-nums">{formatSi(p.fswHz, 'Hz')}</td>
                <td className="tabular-nums">{p.dutyLimit.toFixed(3)}</td>
                <td className="tabular-nums">{p.turnsRatio.toFixed(3)}</td>
                <td>{p.mainSwitch ?? 'auto'}</td><td>{p.rectifier ?? 'auto'}</td><td>{p.core ?? 'auto'}</td>
                <td><a className="text-accent hover:underline" href={handoffHref(specId, p.scheme, overrideOf(p), p.fswHz === fswHz ? null : p.fswHz)} data-open-point>Open in Compare</a></td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
