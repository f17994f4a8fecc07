import type { NormalisedSpec, PartsLibrary } from '../../engine';
import type { CloudBounds } from './fronts';
import type { SweepPlan } from './plan';
import type { IndexRange } from './run';

/**
 * Main thread → worker. `init` once when the page loads (the worker keeps the spec and library, so the
 * library is indexed once and the engine is warm); `run` per sweep with this worker's share of the plan.
 */
export type SweepRequest =
  | { type: 'init'; spec: NormalisedSpec; library: PartsLibrary; warmPoints: number }
  | { type: 'run'; job: number; plan: SweepPlan; ranges: IndexRange[] };

/** Times are epoch milliseconds (`performance.timeOrigin + performance.now()`), comparable across threads. */
export interface PartTimes { receivedAt: number; evaluatedAt: number; summarisedAt: number }

/** Worker → main thread. */
export type SweepMessage =
  | { type: 'ready'; warmMs: number }
  | { type: 'progress'; job: number; done: number }
  | { type: 'error'; job: number | null; message: string }
  | {
    type: 'part';
    job: number;
    ranges: IndexRange[];
    /** STRIDE numbers per point, in the order of `ranges` (transferred, not copied). */
    data: Float64Array;
    count: number;
    feasible: number;
    bounds: CloudBounds;
    /** Per scheme (plan order) this part's Pareto front, plan indices. */
    fronts: number[][];
    times: PartTimes;
  };
