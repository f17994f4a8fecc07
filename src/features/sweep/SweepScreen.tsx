import { lazy, Suspense, useEffect, useMemo, useRef, useState } from 'react';
import { SCHEME_IDS, SCHEME_LABELS, type NormalisedSpec, type PartsLibrary, type SchemeId } from '../../engine';
import { SCHEME_STYLES } from '../../lib/scheme-style';
import { formatSi } from '../../lib/si';
import { handoffHref } from './handoff';
import { DEFAULT_SETTINGS, planSweep, settingsProblems, type SweepSettings } from './plan';
import { overrideOf, pointAt, type DesignPoint } from './points';
import type { SweepMessage, SweepRequest } from './protocol';

// Chart.js loads while the user sets up the sweep, so the first map does not wait for it.
const loadChart = (): Promise<typeof import('./SweepChart')> => import('./SweepChart');
const SweepChart = lazy(loadChart);
type Done = Extract<SweepMessage, { type: 'done' }>;

interface Props {
  specId: string;
  spec: NormalisedSpec;
  library: PartsLibrary;
}

type Status = { kind: 'idle' } | { kind: 'running'; done: number; total: number } | { kind: 'cancelled'; done: number; total: number } | { kind: 'error'; message: string } | { kind: 'done' };

/** Figures of the last run (also exposed to the browser test). */
export interface SweepTiming { points: number; evaluateMs: number; workerMs: number; totalMs: number }

/** The Sweep island: settings, a worker run with progress and cancel, the cost-versus-loss map and the overall front as a table. */
export default function SweepScreen({ specId, spec, library }: Props) {
  const [settings, setSettings] = useState<SweepSettings>({ ...DEFAULT_SETTINGS, schemes: [...spec.schemes] });
  const [status, setStatus] = useState<Status>({ kind: 'idle' });
  const [result, setResult] = useState<Done | null>(null);
  const [timing, setTiming] = useState<SweepTiming | null>(null);
  const worker = useRef<Worker | null>(null);
  const started = useRef(0);
  const problems = settingsProblems(settings);
  const estimate = useMemo(() => (problems.length === 0 ? planSweep(spec, library, settings).total : 0), [settings]);
  useEffect(() => {
    void loadChart();
    return () => worker.current?.terminate();
  }, []);

  const run = (): void => {
    if (problems.length > 0) return;
    worker.current?.terminate();
    const w = new Worker(new URL('./sweep.worker.ts', import.meta.url), { type: 'module' });
    worker.current = w;
    started.current = performance.now();
    setStatus({ kind: 'running', done: 0, total: estimate });
    w.onmessage = (event: MessageEvent<SweepMessage>) => {
      const m = event.data;
      if (m.type === 'planned') setStatus({ kind: 'running', done: 0, total: m.total });
      else if (m.type === 'progress') setStatus({ kind: 'running', done: m.done, total: m.total });
      else if (m.type === 'error') { setStatus({ kind: 'error', message: m.message }); w.terminate(); }
      else { setResult(m); setStatus({ kind: 'done' }); w.terminate(); worker.current = null; }
    };
    w.onerror = (event) => setStatus({ kind: 'error', message: event.message || 'The sweep worker stopped unexpectedly.' });
    const request: SweepRequest = { spec, library, settings };
    w.postMessage(request);
  };
  const cancel = (): void => {
    worker.current?.terminate();
    worker.current = null;
    setStatus((s) => (s.kind === 'running' ? { kind: 'cancelled', done: s.done, total: s.total } : s));
  };
  const drawn = (): void => {
    if (!result) return;
    const t: SweepTiming = { points: result.count, evaluateMs: result.evaluateMs, workerMs: result.workerMs, totalMs: performance.now() - started.current };
    setTiming(t);
    (window as unknown as { __sweepTiming?: SweepTiming }).__sweepTiming = t;
  };
  const pick = (p: DesignPoint): void => window.location.assign(handoffHref(specId, p.scheme, overrideOf(p), p.fswHz === spec.fswHz ? null : p.fswHz));
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

      {!result && status.kind !== 'running' && (
        <p className="card p-6 text-sm text-muted" data-sweep-empty>Choose what to vary and run the sweep: every design point is evaluated in the browser on the engine's lean path, and the cost-versus-loss map appears here.</p>
      )}
      {result && (
        <section className="card space-y-3 p-4" aria-labelledby="sweep-map-title" data-sweep-result data-points={result.count}>
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <h2 id="sweep-map-title" className="font-semibold">Cost against loss</h2>
            <p className="text-sm text-muted" data-sweep-figures>
              {result.count.toLocaleString('en')} points, {result.feasible.toLocaleString('en')} feasible
              {timing && <> · evaluated in {timing.evaluateMs.toFixed(0)} ms, drawn {timing.totalMs.toFixed(0)} ms after Run ({Math.round(result.count / (timing.evaluateMs / 1000)).toLocaleString('en')} points/s)</>}
            </p>
          </div>
          {result.feasible === 0 ? (
            <p className="text-sm text-warn" data-no-feasible>No design point of this sweep is feasible. Widen the frequency range, allow more duty-limit steps, or vary the parts.</p>
          ) : (
            <Suspense fallback={<p className="text-sm text-muted">Drawing the map…</p>}>
              <SweepChart result={result} currency={currency} onPick={pick} onDrawn={drawn} />
            </Suspense>
          )}
          <p className="text-xs text-muted">Each marker is one design point (a thinned sample where points overlap); lines are each scheme's Pareto front, the dark line with crosses the overall front. Hover for the design point; click it to open Compare with it applied. Losses at nominal input and full load; cost at the set's annual volume.</p>
          {result.overall.length > 0 && <FrontTable result={result} specId={specId} fswHz={spec.fswHz} currency={currency} />}
        </section>
      )}
    </div>
  );
}

function FrontTable({ result, specId, fswHz, currency }: { result: Done; specId: string; fswHz: number; currency: string }) {
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
                <td className="tabular-nums">{formatSi(p.lossW, 'W')}</td>
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
