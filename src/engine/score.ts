import type { ScoreWeights } from '../schemas/spec';

/** The five normalised sub-scores (0…1) the weighted score combines. */
export interface SubScores {
  stress: number;
  dutyHeadroom: number;
  partCount: number;
  cost: number;
  efficiency: number;
}

const clamp01 = (x: number): number => (x < 0 ? 0 : x > 1 ? 1 : x);

/**
 * Sub-scores (documented heuristics, common practice):
 * stress = Vin,max/stress (1 when a switch sees only the input);
 * dutyHeadroom = dutyLimit/0.75 (longer usable duty → lower RMS and wider input range);
 * partCount = (40 − count)/30; cost = 1.5 − bom/reference (reference = target cost or 0.1 per W);
 * efficiency = (η − (target − 0.07))/0.1 (target default 0.9).
 */
export function subScores(
  vinMaxV: number, switchStressV: number, dutyLimit: number, partCount: number, bomCost: number,
  efficiency: number, poutW: number, targetUnitCost: number | null, targetEfficiency: number | null,
): SubScores {
  const refCost = targetUnitCost ?? 0.1 * poutW;
  const refEff = targetEfficiency ?? 0.9;
  return {
    stress: clamp01(vinMaxV / switchStressV),
    dutyHeadroom: clamp01(dutyLimit / 0.75),
    partCount: clamp01((40 - partCount) / 30),
    cost: refCost > 0 ? clamp01(1.5 - bomCost / refCost) : 0,
    efficiency: Number.isFinite(efficiency) ? clamp01((efficiency - (refEff - 0.07)) / 0.1) : 0,
  };
}

/** Weighted score 0–100: 100·Σ wi·si / Σ wi. RangeError when all weights are zero. */
export function weightedScore(s: SubScores, w: ScoreWeights): number {
  const sum = w.stress + w.dutyHeadroom + w.partCount + w.cost + w.efficiency;
  if (!(sum > 0)) throw new RangeError('score weights must not all be zero');
  const v = (w.stress * s.stress + w.dutyHeadroom * s.dutyHeadroom + w.partCount * s.partCount + w.cost * s.cost + w.efficiency * s.efficiency) / sum;
  return Math.round(v * 1000) / 10;
}
