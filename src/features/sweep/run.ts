import { LeanSweeper, type NormalisedSpec, type PartsLibrary } from '../../engine';
import type { SchemeOverride } from '../../schemas/spec';
import type { SweepPlan } from './plan';

/** Numbers kept per design point (a flat Float64Array, STRIDE numbers each). */
export const F = { scheme: 0, fswHz: 1, dutyLimit: 2, turnsRatio: 3, main: 4, rect: 5, core: 6, cost: 7, lossW: 8, efficiency: 9, feasible: 10 } as const;
export const STRIDE = 11;

/** A half-open run of plan indices [from, to). */
export type IndexRange = readonly [from: number, to: number];

/**
 * Deals the plan's indices to `parts` workers in interleaved chunks (chunk k goes to part k mod parts),
 * so every part gets a like mix of schemes, frequencies and parts and they finish together.
 * Each index belongs to exactly one part; within a part the ranges rise.
 */
export function partRanges(total: number, parts: number, chunk = 1024): IndexRange[][] {
  const bounds: number[] = [];
  for (let from = 0; from < total; from += chunk) bounds.push(from);
  bounds.push(total);
  return dealChunks(bounds, parts);
}

/** Deals the chunks between rising `bounds` (first 0, last the total) to `parts` parts, chunk k to part k mod parts. */
export function dealChunks(bounds: readonly number[], parts: number): IndexRange[][] {
  if (!(Number.isInteger(parts) && parts >= 1)) throw new RangeError(`parts must be a whole number of at least 1, got ${parts}`);
  const out: IndexRange[][] = Array.from({ length: parts }, () => []);
  for (let k = 0; k + 1 < bounds.length; k++) if (bounds[k + 1]! > bounds[k]!) out[k % parts]!.push([bounds[k]!, bounds[k + 1]!]);
  return out;
}

/**
 * Each scheme's block of plan indices (plan order): where it starts, and its front groups. A group is every
 * main switch, rectifier and core for one frequency and duty limit: the points that share the engine's front
 * stages (LeanSweeper).
 */
export function schemeBlocks(plan: SweepPlan): { start: number; group: number; groups: number }[] {
  const nr = plan.rectifiers.length, nc = plan.cores.length;
  let start = 0;
  return plan.schemes.map((_, si) => {
    const block = { start, group: plan.mainSwitches[si]!.length * nr * nc, groups: plan.fswHz.length * plan.dutyLimits[si]!.length };
    start += block.group * block.groups;
    return block;
  });
}

/**
 * Chunk bounds of a plan at whole front groups (schemeBlocks), about `target` points each: a chunk edge
 * inside a group would make two workers compute the same front stages.
 */
export function planChunks(plan: SweepPlan, target = 1024): number[] {
  const bounds = [0];
  for (const { start, group, groups } of schemeBlocks(plan)) {
    const per = Math.max(1, Math.round(target / group));
    for (let g = per; g < groups; g += per) bounds.push(start + g * group);
    bounds.push(start + groups * group);
  }
  return bounds;
}

/** A fresh copy of `ranges` (see ownPlan in plan.ts: a worker feeds the sweep loop arrays built the same way each time). */
export function ownRanges(ranges: readonly IndexRange[]): IndexRange[] {
  return ranges.map(([a, b]) => [Number(a), Number(b)]);
}

/** Number of indices the ranges cover. */
export function rangeCount(ranges: readonly IndexRange[]): number {
  return ranges.reduce((n, [a, b]) => n + (b - a), 0);
}

/** Plan index of the `local`-th point a part evaluated over `ranges` (its position in the part's array). */
export function globalIndex(ranges: readonly IndexRange[], local: number): number {
  let left = local;
  for (const [a, b] of ranges) {
    if (left < b - a) return a + left;
    left -= b - a;
  }
  throw new RangeError(`local index ${local} lies beyond the part's ${rangeCount(ranges)} points`);
}

let lastSweeper: LeanSweeper | null = null;

/**
 * One sweeper per library, reused from one call to the next (a worker calls runSweep for every warm-up slice
 * and every Run: new sweepers would leave their kept records, which live long enough to reach the old
 * generation, for a major collection during a later Run). Its kept states are forgotten each time.
 */
function sweeperFor(library: PartsLibrary, slots: number): LeanSweeper {
  if (!lastSweeper || lastSweeper.library !== library || lastSweeper.slots < slots) lastSweeper = new LeanSweeper(library, slots);
  lastSweeper.forget();
  return lastSweeper;
}

/**
 * One walk over a plan: its per-run state, and the loop over a range of plan indices. A class, and the loop a
 * prototype method, so every walk (each warm-up slice, each Run) has the same shape and runs the same function:
 * the JIT optimises `range` as a whole function during the warm-up, and a Run enters that code directly.
 * (With the loop inside runSweep, called once per Run, each Run started in the interpreter and the optimising
 * compiler only caught up part-way through, by on-stack replacement.)
 */
class Walk {
  private readonly nf: number;
  private readonly nr: number;
  private readonly nc: number;
  private readonly blockStart: number[];
  private readonly base: NormalisedSpec;
  // One override record per scheme, rewritten per point (the engine keeps no reference past the call): a sweep
  // allocates nothing per point.
  private readonly partIds: NonNullable<SchemeOverride['partIds']> = {};
  private readonly override: SchemeOverride = { dutyLimit: 0, partIds: this.partIds };
  private readonly overrides: Record<string, SchemeOverride> = {};
  private overridden = '';
  private si = 0;
  private readonly sweeper: LeanSweeper;
  /** Points written so far. */
  k = 0;

  constructor(spec: NormalisedSpec, library: PartsLibrary, private readonly plan: SweepPlan, private readonly out: Float64Array, private readonly onProgress: ((done: number) => boolean | void) | undefined, private readonly every: number) {
    this.nf = plan.fswHz.length; this.nr = plan.rectifiers.length; this.nc = plan.cores.length;
    this.blockStart = schemeBlocks(plan).map((b) => b.start);
    this.base = { ...spec, overrides: this.overrides };
    this.sweeper = sweeperFor(library, this.nr * this.nc);
  }

  /** Evaluates plan indices [from, to); false once `onProgress` asked to stop. */
  range(from: number, to: number): boolean {
    const { plan, nf, nr, nc, blockStart, base, partIds, override, overrides, sweeper, out } = this;
    let si = this.si;
    for (let g = from; g < to; g++) {
      while (si + 1 < blockStart.length && g >= blockStart[si + 1]!) si++;
      while (si > 0 && g < blockStart[si]!) si--;
      const scheme = plan.schemes[si]!;
      const mains = plan.mainSwitches[si]!;
      const nm = mains.length;
      let idx = g - blockStart[si]!;
      const ci = idx % nc; idx = (idx - ci) / nc;
      const ri = idx % nr; idx = (idx - ri) / nr;
      const mi = idx % nm; idx = (idx - mi) / nm;
      const nd = plan.dutyLimits[si]!.length;
      const di = idx % nd;
      const fi = (idx - di) / nd;
      if (fi >= nf) throw new RangeError(`plan index ${g} lies beyond the plan's ${plan.total} points`);
      const fswHz = plan.fswHz[fi]!, dutyLimit = plan.dutyLimits[si]![di]!;
      partIds.mainSwitch = mains[mi] ?? undefined;
      partIds.rectifier = plan.rectifiers[ri] ?? undefined;
      partIds.core = plan.cores[ci] ?? undefined;
      override.dutyLimit = dutyLimit;
      if (this.overridden !== scheme) {
        delete overrides[this.overridden];
        overrides[scheme] = override;
        this.overridden = scheme;
      }
      base.fswHz = fswHz;
      const r = sweeper.evaluate(base, scheme, ri * nc + ci, g - mi * nr * nc);
      const k = this.k++;
      const o = k * STRIDE;
      out[o] = si; out[o + 1] = fswHz; out[o + 2] = dutyLimit; out[o + 3] = r.turnsRatio;
      out[o + 4] = mains[mi] ? mi : -1; out[o + 5] = plan.rectifiers[ri] ? ri : -1; out[o + 6] = plan.cores[ci] ? ci : -1;
      out[o + 7] = r.bomCost; out[o + 8] = r.lossW; out[o + 9] = r.efficiency; out[o + 10] = r.feasible && Number.isFinite(r.bomCost) && Number.isFinite(r.lossW) ? 1 : 0;
      if (this.onProgress && (k + 1) % this.every === 0 && this.onProgress(k + 1) === false) { this.si = si; return false; }
    }
    this.si = si;
    return true;
  }
}

/**
 * Evaluates the plan's points in `ranges` (default: all of them) on the engine's lean path and writes
 * them one after the other into `out` (STRIDE numbers each; with the default range, position = plan index).
 * Plan index order is scheme, frequency, duty limit, main switch, rectifier, core (core fastest).
 * Points that differ only in the main switch share the engine's front stages: each (rectifier, core) pair
 * keeps its slot, keyed by the plan index of the same point with the first main switch.
 * `onProgress(done)` is called every `every` points; returning false stops early (the count done is returned).
 */
export function runSweep(spec: NormalisedSpec, library: PartsLibrary, plan: SweepPlan, out: Float64Array, onProgress?: (done: number) => boolean | void, every = 5000, ranges: readonly IndexRange[] = [[0, plan.total]]): number {
  const walk = new Walk(spec, library, plan, out, onProgress, every);
  for (const [from, to] of ranges) if (!walk.range(from, to)) break;
  return walk.k;
}
