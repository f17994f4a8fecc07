/// <reference lib="webworker" />
/**
 * One sweep worker. It is started when the Sweep page loads, keeps the spec and the parts library it is
 * given once, and evaluates its share of each plan on the engine's lean path. The page terminates it to cancel.
 */
import { evaluateLean, type NormalisedSpec, type PartsLibrary } from '../../engine';
import { summarise } from './fronts';
import type { SweepMessage, SweepRequest } from './protocol';
import { globalIndex, rangeCount, runSweep, STRIDE } from './run';

const scope = self as unknown as DedicatedWorkerGlobalScope;
const post = (m: SweepMessage, transfer: Transferable[] = []): void => scope.postMessage(m, transfer);
const now = (): number => performance.timeOrigin + performance.now();
let spec: NormalisedSpec | null = null;
let library: PartsLibrary | null = null;

scope.onmessage = (event: MessageEvent<SweepRequest>): void => {
  const m = event.data;
  if (m.type === 'init') {
    const t0 = performance.now();
    spec = m.spec;
    library = m.library;
    // Index the library and let the JIT compile the engine's hot path before the first Run; results are discarded.
    for (let k = 0; k < 200; k++) for (const scheme of spec.schemes) evaluateLean(spec, scheme, library);
    post({ type: 'ready', warmMs: performance.now() - t0 });
    return;
  }
  const receivedAt = now();
  try {
    if (!spec || !library) throw new Error('The sweep worker was asked to run before it was given the requirement set.');
    const count = rangeCount(m.ranges);
    const data = new Float64Array(count * STRIDE);
    let last = performance.now();
    const progress = (done: number): void => {
      const t = performance.now();
      if (t - last < 200) return;
      last = t;
      post({ type: 'progress', job: m.job, done });
    };
    runSweep(spec, library, m.plan, data, progress, 256, m.ranges);
    const evaluatedAt = now();
    const part = summarise(data, count, m.plan.schemes.length);
    const fronts = part.fronts.map((f) => f.map((local) => globalIndex(m.ranges, local)));
    post({
      type: 'part', job: m.job, ranges: m.ranges, data, count, feasible: part.feasible, bounds: part.bounds, fronts,
      times: { receivedAt, evaluatedAt, summarisedAt: now() },
    }, [data.buffer]);
  } catch (error) {
    post({ type: 'error', job: m.job, message: error instanceof Error ? error.message : String(error) });
  }
};
