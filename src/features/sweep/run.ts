import { evaluateLean, type NormalisedSpec, type PartsLibrary } from '../../engine';
import type { SchemeOverride } from '../../schemas/spec';
import type { SweepPlan } from './plan';

/** Numbers kept per design point (a flat Float64Array, STRIDE numbers each). */
export const F = { scheme: 0, fswHz: 1, dutyLimit: 2, turnsRatio: 3, main: 4, rect: 5, core: 6, cost: 7, lossW: 8, efficiency: 9, feasible: 10 } as const;
export const STRIDE = 11;

/**
 * Evaluates every point of the plan on the engine's lean path and writes it into `out`.
 * `onProgress(done)` is called every `every` points; returning false stops early (the count done is returned).
 */
export function runSweep(spec: NormalisedSpec, library: PartsLibrary, plan: SweepPlan, out: Float64Array, onProgress?: (done: number) => boolean | void, every = 5000): number {
  let k = 0;
  const base = { ...spec };
  for (let si = 0; si < plan.schemes.length; si++) {
    const scheme = plan.schemes[si]!;
    for (const fswHz of plan.fswHz) {
      base.fswHz = fswHz;
      for (const dutyLimit of plan.dutyLimits[si]!) {
        const mains = plan.mainSwitches[si]!;
        for (let mi = 0; mi < mains.length; mi++) {
          for (let ri = 0; ri < plan.rectifiers.length; ri++) {
            for (let ci = 0; ci < plan.cores.length; ci++) {
              const partIds: NonNullable<SchemeOverride['partIds']> = {};
              if (mains[mi]) partIds.mainSwitch = mains[mi]!;
              if (plan.rectifiers[ri]) partIds.rectifier = plan.rectifiers[ri]!;
              if (plan.cores[ci]) partIds.core = plan.cores[ci]!;
              base.overrides = { [scheme]: { dutyLimit, partIds } };
              const r = evaluateLean(base, scheme, library);
              const o = k * STRIDE;
              out[o] = si; out[o + 1] = fswHz; out[o + 2] = dutyLimit; out[o + 3] = r.turnsRatio;
              out[o + 4] = mains[mi] ? mi : -1; out[o + 5] = plan.rectifiers[ri] ? ri : -1; out[o + 6] = plan.cores[ci] ? ci : -1;
              out[o + 7] = r.bomCost; out[o + 8] = r.lossW; out[o + 9] = r.efficiency; out[o + 10] = r.feasible && Number.isFinite(r.bomCost) && Number.isFinite(r.lossW) ? 1 : 0;
              k++;
              if (onProgress && k % every === 0 && onProgress(k) === false) return k;
            }
          }
        }
      }
    }
  }
  return k;
}

/**
 * Indices of the Pareto front (lower cost and lower loss both better) among feasible points, in
 * order of rising cost: sort by cost, keep each point whose loss is below every cheaper one (derived).
 */
export function paretoFront(data: Float64Array, count: number, scheme: number | null): number[] {
  const idx: number[] = [];
  for (let i = 0; i < count; i++) {
    const o = i * STRIDE;
    if (data[o + F.feasible] === 1 && (scheme === null || data[o] === scheme)) idx.push(i);
  }
  idx.sort((a, b) => data[a * STRIDE + F.cost]! - data[b * STRIDE + F.cost]! || data[a * STRIDE + F.lossW]! - data[b * STRIDE + F.lossW]!);
  const front: number[] = [];
  let best = Infinity;
  for (const i of idx) {
    const loss = data[i * STRIDE + F.lossW]!;
    if (loss < best) { front.push(i); best = loss; }
  }
  return front;
}

/**
 * One representative point per cell of a cols×rows grid over the feasible cloud, per scheme, so a
 * chart draws a few thousand markers instead of every point (the fronts are always drawn in full).
 */
export function thinForDisplay(data: Float64Array, count: number, schemes: number, cols = 120, rows = 80): { clouds: number[][]; bounds: { costMin: number; costMax: number; lossMin: number; lossMax: number } } {
  let costMin = Infinity, costMax = -Infinity, lossMin = Infinity, lossMax = -Infinity;
  for (let i = 0; i < count; i++) {
    const o = i * STRIDE;
    if (data[o + F.feasible] !== 1) continue;
    const c = data[o + F.cost]!, l = data[o + F.lossW]!;
    if (c < costMin) costMin = c; if (c > costMax) costMax = c;
    if (l < lossMin) lossMin = l; if (l > lossMax) lossMax = l;
  }
  const clouds: number[][] = Array.from({ length: schemes }, () => []);
  if (costMin === Infinity) return { clouds, bounds: { costMin: 0, costMax: 0, lossMin: 0, lossMax: 0 } };
  const seen = new Uint8Array(schemes * cols * rows);
  const cx = (cols - 1) / Math.max(costMax - costMin, 1e-12), ly = (rows - 1) / Math.max(lossMax - lossMin, 1e-12);
  for (let i = 0; i < count; i++) {
    const o = i * STRIDE;
    if (data[o + F.feasible] !== 1) continue;
    const s = data[o]!;
    const cell = (s * rows + Math.round((data[o + F.lossW]! - lossMin) * ly)) * cols + Math.round((data[o + F.cost]! - costMin) * cx);
    if (seen[cell]) continue;
    seen[cell] = 1;
    clouds[s]!.push(i);
  }
  return { clouds, bounds: { costMin, costMax, lossMin, lossMax } };
}
