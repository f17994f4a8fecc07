import type { SchemeOverride } from '../../schemas/spec';
import type { SweepPlan } from './plan';
import { F, STRIDE } from './run';

/** One design point read back from the sweep's numbers, for the tooltip, the table and the hand-over. */
export interface DesignPoint {
  index: number;
  scheme: SweepPlan['schemes'][number];
  fswHz: number;
  dutyLimit: number;
  turnsRatio: number;
  mainSwitch: string | null;
  rectifier: string | null;
  core: string | null;
  cost: number;
  lossW: number;
  efficiency: number;
}

export function pointAt(plan: SweepPlan, data: Float64Array, index: number): DesignPoint {
  const o = index * STRIDE;
  const s = data[o + F.scheme]!;
  const main = data[o + F.main]!, rect = data[o + F.rect]!, core = data[o + F.core]!;
  return {
    index, scheme: plan.schemes[s]!, fswHz: data[o + F.fswHz]!, dutyLimit: data[o + F.dutyLimit]!, turnsRatio: data[o + F.turnsRatio]!,
    mainSwitch: main >= 0 ? plan.mainSwitches[s]![main]! : null,
    rectifier: rect >= 0 ? plan.rectifiers[rect]! : null,
    core: core >= 0 ? plan.cores[core]! : null,
    cost: data[o + F.cost]!, lossW: data[o + F.lossW]!, efficiency: data[o + F.efficiency]!,
  };
}

/** The overrides that reproduce a point on Compare (the frequency travels separately). */
export function overrideOf(p: DesignPoint): SchemeOverride {
  const partIds: NonNullable<SchemeOverride['partIds']> = {};
  if (p.mainSwitch) partIds.mainSwitch = p.mainSwitch;
  if (p.rectifier) partIds.rectifier = p.rectifier;
  if (p.core) partIds.core = p.core;
  return { dutyLimit: Number(p.dutyLimit.toFixed(6)), ...(Object.keys(partIds).length > 0 ? { partIds } : {}) };
}
