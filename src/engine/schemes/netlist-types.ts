import type { NormalisedSpec } from '../../schemas/spec';
import type { SchemeId } from '../scheme-ids';

/** Which end of the input range (or the nominal input) a netlist is drawn at. */
export type VinCase = 'min' | 'nom' | 'max';
export const VIN_CASES: readonly VinCase[] = ['min', 'nom', 'max'];

/**
 * Everything a netlist needs for one scheme at one input voltage, in SI units, taken from the
 * engine's result so that the simulator is checked against the very design the engine reports.
 */
export interface NetlistPoint {
  scheme: SchemeId;
  label: string;
  vinCase: VinCase;
  vinV: number;
  voutV: number;
  ioutA: number;
  fswHz: number;
  /** Duty at this input, D = K/Vin (K = Vin·D, constant in regulation). */
  duty: number;
  turnsRatio: number;
  resetTurnsRatio: number | null;
  lmH: number;
  /** Leakage inductance (engine: Llk = leakageRatio·Lm), used where the reset network absorbs its energy. */
  llkH: number;
  rectifierDropV: number;
  windingDropV: number;
  outputInductanceH: number;
  outputCapacitanceF: number;
  clampCapacitorV: number | null;
  clampResistorOhm: number | null;
  clampCapacitanceF: number | null;
  resonantCapacitanceF: number | null;
  activeClampVariant: NormalisedSpec['activeClampVariant'];
  magnetizingPeakA: number;
  /** Magnetizing current at the start of the on time at this input (the engine's waveform; offset − ΔIm/2 when bipolar). */
  magnetizingStartA: number;
  /** Co(er) of one main-switch position (parts in parallel together), 0 when the library has no such part. */
  switchCapacitanceF: number;
  /** Winding and layout capacitance the engine lumps at the drain node. */
  windingCapacitanceF: number;
  /** The engine's own figures at this input, for the header and the cross-check (switch stress: its rating basis). */
  expected: { switchPeakV: number; switchStressV: number; voutV: number; inductorRippleA: number; magnetizingPeakA: number };
}

/** Formats a number for a netlist (six significant digits, exponent form). */
export type SpiceNumber = (x: number) => string;

/**
 * What a scheme adds to the common netlist (src/features/spice/netlist.ts builds the rest: sources, transformer,
 * rectifiers, filter, load, analysis and measurements). Node names the common part uses: `in` (input), `d` (the
 * drain of the grounded switch), `pa` (between the leakage and the primary), `sa`/`sw` (secondary), `g1`/`g2` (drives).
 */
export interface SchemeNetlist {
  /** The main switch stage (switches with their body diodes), and the node the primary's leakage hangs from. */
  switchStage: { lines: readonly string[]; top: string };
  /** Capacitance at the switch node(s), as the engine lumps it; `windingTop` is the primary's top node. */
  nodeCapacitance(p: NetlistPoint, n: SpiceNumber, windingTop: string): string[];
  /** The reset network; `gate2` is the line of a clamp switch's drive, for the scheme that has one. */
  resetNetwork(p: NetlistPoint, n: SpiceNumber, gate2: string): string[];
  /** Terms of the magnetizing current beyond i(LP) + n·i(LS) (a reset winding's current, weighted by its turns). */
  magnetizingTerms(p: NetlistPoint, n: SpiceNumber): string;
  /** The core-side drain voltage v(in) + v(d) − v(pa) is measured (single switch from the input, with the leakage drawn). */
  measuresCoreVoltage: boolean;
}
