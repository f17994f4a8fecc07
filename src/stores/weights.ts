import { atom } from 'nanostores';
import { DEFAULT_WEIGHTS, type ScoreWeights } from '../schemas/spec';
import { markEdit } from '../lib/perf';

/** Score weights (stress, duty headroom, part count, cost, efficiency), shared by every island. */
export const $weights = atom<ScoreWeights>({ ...DEFAULT_WEIGHTS });

export function setWeight(key: keyof ScoreWeights, value: number): void {
  markEdit();
  $weights.set({ ...$weights.get(), [key]: value });
}

export function loadWeights(weights: Partial<ScoreWeights> | undefined): void {
  $weights.set({ ...DEFAULT_WEIGHTS, ...(weights ?? {}) });
}

export function resetWeights(): void {
  markEdit();
  $weights.set({ ...DEFAULT_WEIGHTS });
}
