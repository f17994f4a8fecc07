import { F, STRIDE } from './run';

/** Extent of the feasible points (cost in the library's currency, loss in W); all zero when none is feasible. */
export interface CloudBounds { costMin: number; costMax: number; lossMin: number; lossMax: number }

/**
 * The Pareto front (lower cost and lower loss both better) of the given point positions, in order of
 * rising cost: sort by cost, then loss, then position, and keep each point whose loss is below every
 * cheaper one (derived). Exact duplicates keep the lowest position, so fronts of parts merge to the
 * same front as the whole.
 */
export function paretoOf(data: Float64Array, positions: number[]): number[] {
  const idx = positions.slice();
  idx.sort((a, b) => data[a * STRIDE + F.cost]! - data[b * STRIDE + F.cost]! || data[a * STRIDE + F.lossW]! - data[b * STRIDE + F.lossW]! || a - b);
  const front: number[] = [];
  let best = Infinity;
  for (const i of idx) {
    const loss = data[i * STRIDE + F.lossW]!;
    if (loss < best) { front.push(i); best = loss; }
  }
  return front;
}

/** Pareto front among the feasible points of one scheme (plan order) or of all (`null`), by rising cost. */
export function paretoFront(data: Float64Array, count: number, scheme: number | null): number[] {
  const idx: number[] = [];
  for (let i = 0; i < count; i++) {
    const o = i * STRIDE;
    if (data[o + F.feasible] === 1 && (scheme === null || data[o] === scheme)) idx.push(i);
  }
  return paretoOf(data, idx);
}

/** What one part of a sweep reports besides its numbers: per-scheme fronts (positions in its array), feasible count and extent. */
export interface PartSummary { fronts: number[][]; feasible: number; bounds: CloudBounds }

/**
 * Per-scheme fronts, feasible count and extent of `count` points in three linear passes and small sorts.
 * Pass 2 keeps each scheme's lowest loss per cost bucket; a point whose loss is not below the lowest
 * loss of a strictly cheaper bucket is dominated (cheaper and no lossier) and is never sorted (derived).
 */
export function summarise(data: Float64Array, count: number, schemes: number, buckets = 512): PartSummary {
  let feasible = 0, costMin = Infinity, costMax = -Infinity, lossMin = Infinity, lossMax = -Infinity;
  for (let i = 0; i < count; i++) {
    const o = i * STRIDE;
    if (data[o + F.feasible] !== 1) continue;
    feasible++;
    const c = data[o + F.cost]!, l = data[o + F.lossW]!;
    if (c < costMin) costMin = c;
    if (c > costMax) costMax = c;
    if (l < lossMin) lossMin = l;
    if (l > lossMax) lossMax = l;
  }
  if (feasible === 0) return { fronts: Array.from({ length: schemes }, () => []), feasible, bounds: { costMin: 0, costMax: 0, lossMin: 0, lossMax: 0 } };
  const perCost = (buckets - 1) / Math.max(costMax - costMin, 1e-300);
  const bucketOf = (c: number): number => Math.min(buckets - 1, Math.floor((c - costMin) * perCost));
  const least = new Float64Array(schemes * buckets).fill(Infinity);
  for (let i = 0; i < count; i++) {
    const o = i * STRIDE;
    if (data[o + F.feasible] !== 1) continue;
    const k = (data[o]! | 0) * buckets + bucketOf(data[o + F.cost]!), l = data[o + F.lossW]!;
    if (l < least[k]!) least[k] = l;
  }
  // below[k]: lowest loss among the scheme's strictly cheaper buckets.
  const below = new Float64Array(schemes * buckets);
  for (let s = 0; s < schemes; s++) {
    let m = Infinity;
    for (let b = 0; b < buckets; b++) { below[s * buckets + b] = m; m = Math.min(m, least[s * buckets + b]!); }
  }
  const candidates: number[][] = Array.from({ length: schemes }, () => []);
  for (let i = 0; i < count; i++) {
    const o = i * STRIDE;
    if (data[o + F.feasible] !== 1) continue;
    const s = data[o]! | 0;
    if (data[o + F.lossW]! < below[s * buckets + bucketOf(data[o + F.cost]!)]!) candidates[s]!.push(i);
  }
  return { fronts: candidates.map((idx) => paretoOf(data, idx)), feasible, bounds: { costMin, costMax, lossMin, lossMax } };
}

/** Joins the extents of parts (parts without feasible points are skipped). */
export function joinBounds(parts: { feasible: number; bounds: CloudBounds }[]): CloudBounds {
  const withPoints = parts.filter((p) => p.feasible > 0).map((p) => p.bounds);
  if (withPoints.length === 0) return { costMin: 0, costMax: 0, lossMin: 0, lossMax: 0 };
  return {
    costMin: Math.min(...withPoints.map((b) => b.costMin)), costMax: Math.max(...withPoints.map((b) => b.costMax)),
    lossMin: Math.min(...withPoints.map((b) => b.lossMin)), lossMax: Math.max(...withPoints.map((b) => b.lossMax)),
  };
}

/**
 * Joins the parts' fronts (plan indices) into each scheme's front and the overall front: every point of
 * a front is on its part's front, so the front of the union of part fronts is the whole front (derived).
 */
export function joinFronts(data: Float64Array, partFronts: number[][][], schemes: number): { fronts: number[][]; overall: number[] } {
  const fronts = Array.from({ length: schemes }, (_, s) => paretoOf(data, partFronts.flatMap((p) => p[s] ?? [])));
  return { fronts, overall: paretoOf(data, fronts.flat()) };
}
