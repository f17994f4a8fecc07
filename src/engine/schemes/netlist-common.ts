import type { NetlistPoint, SchemeNetlist, SpiceNumber } from './netlist-types';

/** One switch from the drain to ground, with its body diode. */
export const GROUNDED_SWITCH: SchemeNetlist['switchStage'] = { lines: ['S1 d 0 g1 0 SWI', 'DB1 0 d DIDEAL'], top: 'in' };

/** The drain-node capacitance the engine lumps: the switch's Co(er) and the winding capacitance (design/stress.ts). */
export function drainCapacitance(p: NetlistPoint, n: SpiceNumber): string[] {
  return ["* Drain-node capacitance: the switch's Co(er) and the winding capacitance", `CDN d 0 ${n(p.switchCapacitanceF + p.windingCapacitanceF)}`];
}
