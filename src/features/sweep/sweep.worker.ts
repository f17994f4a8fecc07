/// <reference lib="webworker" />
/** Runs one sweep off the main thread; the page terminates the worker to cancel. */
import { planSweep } from './plan';
import type { SweepMessage, SweepRequest } from './protocol';
import { paretoFront, runSweep, STRIDE, thinForDisplay, F } from './run';

const post = (m: SweepMessage, transfer: Transferable[] = []): void => (self as unknown as DedicatedWorkerGlobalScope).postMessage(m, transfer);

self.onmessage = (event: MessageEvent<SweepRequest>): void => {
  const t0 = performance.now();
  try {
    const { spec, library, settings } = event.data;
    const plan = planSweep(spec, library, settings);
    post({ type: 'planned', total: plan.total });
    const data = new Float64Array(plan.total * STRIDE);
    const count = runSweep(spec, library, plan, data, (done) => post({ type: 'progress', done, total: plan.total }), 4000);
    const evaluateMs = performance.now() - t0;
    const fronts = plan.schemes.map((_, s) => paretoFront(data, count, s));
    const overall = paretoFront(data, count, null);
    const { clouds } = thinForDisplay(data, count, plan.schemes.length);
    let feasible = 0;
    for (let i = 0; i < count; i++) feasible += data[i * STRIDE + F.feasible]!;
    post({ type: 'done', plan, data, count, feasible, fronts, overall, clouds, evaluateMs, workerMs: performance.now() - t0 }, [data.buffer]);
  } catch (error) {
    post({ type: 'error', message: error instanceof Error ? error.message : String(error) });
  }
};
