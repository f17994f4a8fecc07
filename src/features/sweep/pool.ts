import type { NormalisedSpec, PartsLibrary } from '../../engine';
import { joinBounds, joinFronts, type CloudBounds } from './fronts';
import type { SweepPlan } from './plan';
import type { PartTimes, SweepMessage, SweepRequest } from './protocol';
import { dealChunks, planChunks, STRIDE } from './run';

/** A finished sweep on the main thread: every point's numbers (plan order), fronts and extent. */
export interface SweepResult {
  plan: SweepPlan;
  data: Float64Array;
  count: number;
  feasible: number;
  bounds: CloudBounds;
  /** Per scheme (plan order) the Pareto front, plan indices by rising cost. */
  fronts: number[][];
  overall: number[];
  times: RunTimes;
}

/** Where a run's time went (epoch ms, comparable across threads). */
export interface RunTimes {
  startedAt: number;
  parts: (PartTimes & { arrivedAt: number; points: number })[];
  mergedAt: number;
}

interface Handlers {
  progress: (done: number, total: number) => void;
  done: (result: SweepResult) => void;
  error: (message: string) => void;
}

type Part = Extract<SweepMessage, { type: 'part' }>;

/**
 * Warm-up points per worker (see sweep.worker.ts): 150,000 on 2 cores, where it was measured. With more
 * workers each one's share of a run is smaller, and so is what a cold start costs it; the page's total
 * warm-up work stays at 300,000 points rather than growing with the core count.
 */
export function warmPointsPerWorker(workers: number): number {
  return Math.round(Math.min(150_000, 300_000 / Math.max(1, workers)));
}
const now = (): number => performance.timeOrigin + performance.now();

/**
 * The page's sweep workers, one per logical core (at most 8), started and warmed when the page loads
 * so Run pays neither start-up nor module loading. Cancelling terminates them and starts fresh ones.
 */
export class SweepPool {
  private workers: Worker[] = [];
  private job = 0;
  private active: { job: number; plan: SweepPlan; handlers: Handlers; parts: (Part & { arrivedAt: number })[]; done: number[]; startedAt: number; data: Float64Array } | null = null;
  /** Milliseconds each worker spent warming up (for the figures line), in start order. */
  readonly warmMs: number[] = [];

  constructor(private readonly spec: NormalisedSpec, private readonly library: PartsLibrary, readonly size = Math.max(1, Math.min(8, navigator.hardwareConcurrency || 2))) {
    this.start();
  }

  private start(): void {
    this.workers = Array.from({ length: this.size }, (_, w) => {
      const worker = new Worker(new URL('./sweep.worker.ts', import.meta.url), { type: 'module' });
      worker.onmessage = (event: MessageEvent<SweepMessage>) => this.receive(w, event.data);
      worker.onerror = (event) => this.fail(event.message || 'A sweep worker stopped unexpectedly.');
      const init: SweepRequest = { type: 'init', spec: this.spec, library: this.library, warmPoints: warmPointsPerWorker(this.size) };
      worker.postMessage(init);
      return worker;
    });
  }

  /** Starts a sweep of `plan` (any running one is cancelled first). `startedAt` is the Run click (epoch ms). */
  run(plan: SweepPlan, startedAt: number, handlers: Handlers): void {
    if (this.active) this.cancel();
    const job = ++this.job;
    // Chunk edges at whole front groups, so no two workers compute the same shared front stages.
    const shares = dealChunks(planChunks(plan), this.workers.length).filter((r) => r.length > 0);
    // The page's copy of the numbers; each part is put in place as it arrives, so the last one finds little left to do.
    this.active = { job, plan, handlers, parts: [], done: shares.map(() => 0), startedAt, data: new Float64Array(plan.total * STRIDE) };
    shares.forEach((ranges, w) => {
      const request: SweepRequest = { type: 'run', job, plan, ranges };
      this.workers[w]!.postMessage(request);
    });
  }

  /** Stops the running sweep at once; fresh workers warm up for the next one. */
  cancel(): void {
    this.active = null;
    for (const w of this.workers) w.terminate();
    this.start();
  }

  dispose(): void {
    this.active = null;
    for (const w of this.workers) w.terminate();
    this.workers = [];
  }

  private fail(message: string): void {
    const active = this.active;
    if (!active) return;
    this.cancel();
    active.handlers.error(message);
  }

  private receive(w: number, m: SweepMessage): void {
    if (m.type === 'ready') {
      this.warmMs.push(m.warmMs);
      // For the browser test: each finished worker's warm-up time.
      Object.assign(window, { __sweepWarmedMs: [...this.warmMs] });
      return;
    }
    const active = this.active;
    if (!active || (m.job !== null && m.job !== active.job)) return;
    if (m.type === 'error') { this.fail(m.message); return; }
    if (m.type === 'progress') {
      active.done[w] = m.done;
      active.handlers.progress(active.done.reduce((a, b) => a + b, 0), active.plan.total);
      return;
    }
    const part = { ...m, arrivedAt: now() };
    active.done[w] = m.count;
    placePart(active.data, part);
    active.parts.push(part);
    if (active.parts.length < active.done.length) {
      active.handlers.progress(active.done.reduce((a, b) => a + b, 0), active.plan.total);
      return;
    }
    this.active = null;
    active.handlers.done(joinParts(active.plan, active.data, active.parts, active.startedAt));
  }
}

/** Copies a part's numbers to their places in plan order. */
export function placePart(data: Float64Array, part: Pick<Part, 'ranges' | 'data'>): void {
  let pos = 0;
  for (const [a, b] of part.ranges) {
    data.set(part.data.subarray(pos * STRIDE, (pos + b - a) * STRIDE), a * STRIDE);
    pos += b - a;
  }
}

/** The result once every part's numbers are in place: fronts and extents joined. */
export function joinParts(plan: SweepPlan, data: Float64Array, parts: (Part & { arrivedAt: number })[], startedAt: number): SweepResult {
  const { fronts, overall } = joinFronts(data, parts.map((p) => p.fronts), plan.schemes.length);
  return {
    plan, data, count: parts.reduce((n, p) => n + p.count, 0), feasible: parts.reduce((n, p) => n + p.feasible, 0), bounds: joinBounds(parts), fronts, overall,
    times: { startedAt, parts: parts.map((p) => ({ ...p.times, arrivedAt: p.arrivedAt, points: p.count })), mergedAt: now() },
  };
}

/** Puts the parts' numbers back in plan order and joins their fronts and extents. */
export function assemble(plan: SweepPlan, parts: (Part & { arrivedAt: number })[], startedAt: number): SweepResult {
  const data = new Float64Array(plan.total * STRIDE);
  for (const part of parts) placePart(data, part);
  return joinParts(plan, data, parts, startedAt);
}
