import type { NormalisedSpec } from '../schemas/spec';
import type { LossesW } from './design/types';
import type { Finding } from './feasibility';
import type { SchemeId } from './scheme-ids';
import type { TraceEntry } from './trace';

/** One power-stage BOM line. */
export interface BomLine {
  role: string;
  partId: string;
  qty: number;
  unitPrice: number;
}

/** Result for one scheme (field names are a contract; see src/engine/README.md). */
export interface SchemeResult {
  scheme: SchemeId;
  label: string;
  feasible: boolean;
  findings: Finding[];
  turnsRatio: number;
  /** Nr/Np, tertiary winding only (null otherwise). */
  resetTurnsRatio: number | null;
  dutyLimit: number;
  duty: { atVinMin: number; atVinNom: number; atVinMax: number };
  switchCount: number;
  switchPeakV: number;
  switchStressV: number;
  switchRatingV: number | null;
  rectifierReverseV: { forward: number; freewheel: number };
  /** Active clamp (chosen variant) or RCD clamp voltage; null for the other schemes. */
  clampCapacitorV: number | null;
  magnetizingPeakA: number;
  primaryRmsA: number;
  outputInductanceH: number;
  outputCapacitanceF: number;
  core: { partId: string | null; turnsPrimary: number; deltaBT: number; coreLossW: number };
  lossesW: LossesW;
  efficiency: number;
  efficiencyVsLoad: { loadFraction: number; efficiency: number }[];
  partCount: number;
  parts: BomLine[];
  bomCost: number;
  currency: string;
  score: number;
  /** Extra design figures (SI units). */
  details: {
    /** Volt-seconds × fs reaching the core and the output, K = (Vout + drops)/n. */
    voltSecondsV: number;
    dropsV: number;
    /** Output voltage lost to the leakage inductance at Vin,min (commutation and current ramp), n·Llk·fs·(n·IL,max + ΔIm). */
    leakageDropV: number;
    resetDutyLimit: number;
    transientSwitchV: number;
    leakageSpikeV: number;
    primaryPeakA: number;
    inductorRippleA: number;
    magnetizingInductanceH: number;
    leakageInductanceH: number;
    transientFluxSwingT: number;
    availableFluxSwingT: number;
    windowFill: number;
    skinDepthM: number;
    strandAwg: number;
    /** Transformer windings: primary, secondary and any reset winding. */
    windingCount: number;
    /** Copper of all windings at the design current density (kg). */
    copperMassKg: number;
    resonantPeakV: number | null;
    resonantCapacitanceF: number | null;
    clampResistorOhm: number | null;
    clampCapacitanceF: number | null;
    mainSwitchId: string | null;
    mainSwitchParallel: number;
    rectifierId: string | null;
  };
  /** Formula, inputs and source per key figure, keyed by field path. */
  trace: Record<string, TraceEntry>;
}

/** Output of `evaluate` (a contract). */
export interface Comparison {
  engineVersion: string;
  input: NormalisedSpec;
  results: SchemeResult[];
  /** Scheme ids, feasible first, then by score (descending). */
  ranking: SchemeId[];
  partsLibrary: { name: string; version: string; currency: string; demo: boolean };
}

/** Numbers-only result of the lean path used by sweeps. */
export interface LeanResult {
  scheme: SchemeId;
  feasible: boolean;
  turnsRatio: number;
  dutyLimit: number;
  dutyAtVinMin: number;
  dutyAtVinMax: number;
  switchPeakV: number;
  switchStressV: number;
  switchRatingV: number;
  rectifierForwardV: number;
  rectifierFreewheelV: number;
  lossW: number;
  efficiency: number;
  bomCost: number;
  partCount: number;
  score: number;
}
