import type { NormalisedSpec } from '../../schemas/spec';
import type { Design } from '../design/types';
import type { Finding } from '../finding';
import type { SchemeNetlist } from './netlist-types';
import type { SchemeId } from '../scheme-ids';

/**
 * Drain voltage and magnetizing current over the off time of one scheme, and the times to sample them at (x from 0 at
 * turn-off to tOff; a corner of the drawing sits on a knot).
 */
export interface OffShape {
  knots: number[];
  v: (x: number) => number;
  im: (x: number) => number;
  /** Voltage across Lm during the off time when the secondary sees it (the active clamp), else undefined. */
  vLmOff?: number;
}

/** Formula text and source for the scheme-specific key figures (shown on hover). */
export interface SchemeFormulas {
  dutyLimit: string;
  offState: string;
  transient: string;
  forwardReverse: string;
  resetLoss: string;
  source: string;
}

/**
 * One reset scheme: the hooks the common pipeline calls. A sixth scheme is one module
 * implementing this, one line in registry.ts and one test table.
 */
export interface ResetSchemeModel {
  id: SchemeId;
  label: string;
  /** Primary-side power switches. */
  switchCount: number;
  /** Flux swings about zero (±ΔB/2) instead of from remanence upwards. */
  bipolarFlux: boolean;
  /** Leakage energy is clamped by the reset network (no spike allowance needed). */
  leakageClamped: boolean;
  /** Main switches in series in the current path (two-switch: 2). */
  seriesSwitches: number;
  formulas: SchemeFormulas;
  /** BOM role names of the reset network's diode and capacitor. */
  diodeRole: string;
  capacitorRole: string;
  /** Transformer windings: primary and secondary, plus a reset winding where the scheme has one. */
  windingCount: number;
  /** Rms ampere-turns of the windings beyond primary and secondary (the tertiary's reset winding), for their copper (A). */
  extraAmpereTurnsA(d: Design): number;
  /** Stress must be recomputed after sizeReset (the reset network changes the peak). */
  restressAfterReset: boolean;
  /** Reset-limited duty before the margin, for the spec's parameters. */
  resetDutyLimit(spec: NormalisedSpec): number;
  /** Design duty limit: reset limit less the margin, capped by the controller. */
  designDutyLimit(spec: NormalisedSpec): number;
  /** Duty the controller may reach at high line during a transient (before the loop settles). */
  transientDuty(d: Design): number;
  /** Called once K = Vin·D is known: set clamp / resonant design voltages. */
  prepare(d: Design): void;
  /** Primary voltage during reset (magnitude) at vinV, steady state. */
  resetVoltageV(d: Design, vinV: number): number;
  /** Steady off-state voltage of a main switch at vinV (no spike). */
  offStateV(d: Design, vinV: number): number;
  /** High-line transient off-state voltage (no spike). */
  transientV(d: Design): number;
  /** Allowance on top of the steady peak for clamped schemes (ripple, diode recovery), fraction. */
  clampAllowance: number;
  /** Drain voltage at main-switch turn-on. */
  turnOnV(d: Design, vinV: number): number;
  /** Size the reset network once Lm and the main switch are known; may update clamp voltages. */
  sizeReset(d: Design): void;
  /**
   * Dc offset of the magnetizing current at vinV (A): its mean over a period, which the reset network's charge balance
   * sets. 0 for the unipolar schemes (they start from zero each period) and for a lossless resonant reset.
   */
  magnetizingOffsetA(d: Design, vinV: number): number;
  /**
   * Leakage inductance whose energy nothing returns at turn-off (H): it rings into the drain node as the spike a snubber
   * limits and dissipates. 0 where the reset network clamps the leakage.
   */
  spikeLeakageH(d: Design): number;
  /** Share of the period over which the flux falls back during reset at vinV (the iGSE core loss reads it). */
  fluxFallShare(d: Design, vinV: number): number;
  /** The off time of the idealised waveforms at vinV: drain voltage and magnetizing current from turn-off on (derived). */
  offShape(d: Design, vinV: number, tOffS: number, imEnd: number): OffShape;
  /** Primary current in the off time for a magnetizing current `imA` (0 where a reset winding carries it instead). */
  primaryOffA(imA: number): number;
  /** Findings only this scheme raises (its assumptions, its own hazards), after the common ones. */
  ownFindings(d: Design): Finding[];
  /** Nr/Np of a reset winding where the scheme has one, else null (the result's resetTurnsRatio). */
  resetWindingRatio(d: Design): number | null;
  /** The scheme's own elements of its SPICE netlist (switch stage, node capacitance, reset network). */
  netlist: SchemeNetlist;
  /** Reset/clamp loss at vinV and load (W), excluding nothing the common terms already count. */
  resetLossW(d: Design, vinV: number, duty: number, primaryPeakA: number, primaryRmsA: number): number;
}
