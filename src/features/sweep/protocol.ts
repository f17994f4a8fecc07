import type { NormalisedSpec, PartsLibrary } from '../../engine';
import type { SweepPlan, SweepSettings } from './plan';

/** Main thread → worker. */
export interface SweepRequest {
  spec: NormalisedSpec;
  library: PartsLibrary;
  settings: SweepSettings;
}

/** Worker → main thread. */
export type SweepMessage =
  | { type: 'planned'; total: number }
  | { type: 'progress'; done: number; total: number }
  | { type: 'error'; message: string }
  | {
    type: 'done';
    plan: SweepPlan;
    data: Float64Array;
    count: number;
    feasible: number;
    /** Per scheme (plan order) the Pareto front, point indices by rising cost. */
    fronts: number[][];
    overall: number[];
    /** Per scheme a thinned set of point indices for the cloud. */
    clouds: number[][];
    evaluateMs: number;
    workerMs: number;
  };
