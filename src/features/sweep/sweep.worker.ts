/// <reference lib="webworker" />
/**
 * One sweep worker. It is started when the Sweep page loads, keeps the spec and the parts library it is
 * given once, and evaluates its share of each plan on the engine's lean path. The page terminates it to cancel.
 */
import type { NormalisedSpec, PartsLibrary } from '../../engine';
import { summarise } from './fronts';
import { DEFAULT_SETTINGS, ownPlan, planSweep, type SweepPlan } from './plan';
import type { SweepMessage, SweepRequest } from './protocol';
import { globalIndex, ownRanges, rangeCount, runSweep, STRIDE } from './run';

const scope = self as unknown as DedicatedWorkerGlobalScope;
const post = (m: SweepMessage, transfer: Transferable[] = []): void => scope.postMessage(m, transfer);
const now = (): number => performance.timeOrigin + performance.now();
let spec: NormalisedSpec | null = null;
let library: PartsLibrary | null = null;

/**
 * Warm-up. The JIT compiles the engine for the shapes a sweep feeds it (forced parts, shared front stages)
 * only after it has run them a while, and each worker compiles its own copy on threads that share the cores
 * with the sweep. On the 2-core test machine each worker's half of a 100,000-point plan took 480–620 ms on
 * cold workers and 74–108 ms after this warm-up (with ownPlan, the progress path and detachOnce below, which
 * keep the compiled code valid through a Run); a warm-up on a smaller plan of other frequencies did less.
 * So when the page loads, each worker runs the spec's own sweep with the default settings for the points
 * the page asks (150,000 each on 2 cores; warmPointsPerWorker in pool.ts), results discarded. It works in
 * slices of WARM_SLICE points and rests as long as each slice took: at full speed the workers took every
 * core and the page's own tasks (rendering, the settings form) ran 55–150 ms long; at half speed none went
 * over 50 ms and the warm-up takes 0.8–1.5 s. A Run arriving meanwhile starts at once and ends the warm-up.
 */
const WARM_SLICE = 2048;

interface WarmUp { plan: SweepPlan; out: Float64Array; done: number; points: number; startedAt: number }
let warm: WarmUp | null = null;

function warmSlice(): void {
  const w = warm;
  if (!w || !spec || !library) return;
  const t0 = performance.now();
  const from = w.done % w.plan.total;
  const to = Math.min(w.plan.total, from + WARM_SLICE);
  runSweep(spec, library, w.plan, w.out, progress, 256, ownRanges([[from, to]]));
  // The fronts of each part are found in the worker after its points: warm that code too.
  summarise(w.out, to - from, w.plan.schemes.length);
  w.done += to - from;
  // Rest as long as the slice took: the warm-up takes half of this worker's core, leaving the page room.
  if (w.done >= w.points) endWarmUp(); else setTimeout(warmSlice, performance.now() - t0);
}

/**
 * Progress of the running job, at most every 200 ms. One function, taking the same path in the warm-up as in
 * a Run, which the JIT compiles into the sweep loop: the warm-up reports too, as job WARM_JOB, which the page
 * ignores. (When the warm-up skipped the report, a Run's first report hit code the JIT had never seen run and
 * threw the loop's optimised code away, mid-Run.)
 */
const WARM_JOB = -1;
let job = WARM_JOB;
let lastProgress = 0;
function progress(done: number): void {
  const t = performance.now();
  if (t - lastProgress < 200) return;
  lastProgress = t;
  post({ type: 'progress', job, done });
}

function endWarmUp(): void {
  if (!warm) return;
  post({ type: 'ready', warmMs: performance.now() - warm.startedAt });
  warm = null;
}

/**
 * Each Run hands its numbers to the page by transferring their buffer, which detaches it in the worker. The
 * first detach of a Float64Array's buffer in a worker made V8 throw away nearly all of the engine's optimised
 * code ("dependent prototype chain changed", 60-odd functions) just after the first Run, so the second and
 * third Runs paid for compiling it all again on the cores the sweep needs: 130–225 ms per worker against
 * 60–100 ms. Detaching one small buffer before anything is compiled takes that event out of the way.
 */
function detachOnce(): void {
  const probe = new Float64Array(STRIDE);
  structuredClone(probe, { transfer: [probe.buffer] });
}

scope.onmessage = (event: MessageEvent<SweepRequest>): void => {
  const m = event.data;
  if (m.type === 'init') {
    detachOnce();
    spec = m.spec;
    library = m.library;
    const startedAt = performance.now();
    try {
      const plan = ownPlan(planSweep(spec, library, { ...DEFAULT_SETTINGS, schemes: spec.schemes }), library);
      warm = { plan, out: new Float64Array(WARM_SLICE * STRIDE), done: 0, points: m.warmPoints, startedAt };
      if (plan.total > 0 && m.warmPoints > 0) warmSlice(); else endWarmUp();
    } catch {
      // A warm-up is only an optimisation: a spec it cannot plan will report its problem on Run.
      warm = null;
      post({ type: 'ready', warmMs: performance.now() - startedAt });
    }
    return;
  }
  endWarmUp();
  const receivedAt = now();
  try {
    if (!spec || !library) throw new Error('The sweep worker was asked to run before it was given the requirement set.');
    const plan = ownPlan(m.plan, library), ranges = ownRanges(m.ranges);
    const count = rangeCount(ranges);
    const data = new Float64Array(count * STRIDE);
    job = m.job;
    lastProgress = performance.now();
    try {
      runSweep(spec, library, plan, data, progress, 256, ranges);
    } finally {
      job = WARM_JOB;
    }
    const evaluatedAt = now();
    const part = summarise(data, count, plan.schemes.length);
    const fronts = part.fronts.map((f) => f.map((local) => globalIndex(ranges, local)));
    post({
      type: 'part', job: m.job, ranges: m.ranges, data, count, feasible: part.feasible, bounds: part.bounds, fronts,
      times: { receivedAt, evaluatedAt, summarisedAt: now() },
    }, [data.buffer]);
  } catch (error) {
    post({ type: 'error', job: m.job, message: error instanceof Error ? error.message : String(error) });
  }
};
