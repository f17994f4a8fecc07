import type { NormalisedSpec, SchemeOverride } from '../../schemas/spec';
import type { LibraryIndex, PriceTable } from '../parts/index-library';
import type { CapacitorPart, CorePart, InductorPart, MosfetPart, RectifierPart, ResistorPart } from '../parts/types';
import type { SchemeId } from '../scheme-ids';

/** Failure codes the lean path can raise (findings text is added in the full path). */
export type FailCode =
  | 'duty-limit-above-reset' | 'duty-cannot-reach-output' | 'no-switch-for-stress' | 'no-aux-switch'
  | 'no-rectifier' | 'no-core' | 'windings-do-not-fit' | 'flux-above-saturation' | 'resonant-reset-incomplete'
  | 'no-output-capacitor' | 'no-output-inductor' | 'no-clamp-part' | 'unknown-part' | 'leakage-commutation';

/** Loss breakdown in watts (contract field names). */
export interface LossesW {
  switchConduction: number;
  switching: number;
  gateDrive: number;
  resetOrClamp: number;
  rectifiers: number;
  transformer: number;
  inductor: number;
  total: number;
}

/**
 * The working record of one scheme evaluation: filled stage by stage by the lean pipeline,
 * read by findings, trace, waveforms and the full result. All numbers SI. Unit prices of the
 * chosen parts are kept next to them (0 when none) so that cost needs no price lookups.
 */
export interface Design {
  scheme: SchemeId;
  spec: NormalisedSpec;
  index: LibraryIndex;
  /** Unit prices of the index at the spec's annual volume. */
  prices: PriceTable;
  /** The spec's overrides for this scheme, if any. */
  ov: SchemeOverride | undefined;
  poutW: number;
  fails: FailCode[];
  // duty and turns
  resetDutyLimit: number;
  dutyLimit: number;
  /** Duty the controller can reach in a high-line transient (volt-second clamped schemes: steady value). */
  transientDuty: number;
  resetTurnsRatio: number;
  rectifierDropV: number;
  windingDropV: number;
  dropsV: number;
  turnsRatio: number;
  /**
   * Volt-seconds per switching period times fs that reach the core and the output:
   * K = (Vout + drops)/n, constant over line in regulation (Vin·D less what the leakage takes).
   */
  kV: number;
  /** c = Llk·IL,max·fs at Vin,min (V), used for the turns ratio; 0 in the first pass (design/duty.ts). */
  leakageCoefficientV: number;
  /** Output voltage lost to the leakage at Vin,min, n·Llk·fs·(n·IL,max + ΔIm) (V). */
  leakageDropV: number;
  /** Switch duty at three lines, D = (K + Llk·fs·(n·IL,max + ΔIm))/Vin (design/duty.ts). */
  dutyAtVinMin: number;
  dutyAtVinNom: number;
  dutyAtVinMax: number;
  // output filter
  rippleA: number;
  outputInductanceH: number;
  outputCapacitanceF: number;
  inductor: InductorPart | null;
  inductorPrice: number;
  outCap: CapacitorPart | null;
  outCapPrice: number;
  outCapQty: number;
  // rectifiers
  rectForwardV: number;
  rectFreewheelV: number;
  rectDiode: RectifierPart | null;
  rectSr: MosfetPart | null;
  rectQty: number;
  /** Unit price of the chosen rectifier (diode or synchronous MOSFET). */
  rectPrice: number;
  // magnetics
  core: CorePart | null;
  corePrice: number;
  turnsPrimary: number;
  deltaBT: number;
  bTransientT: number;
  bAvailableT: number;
  lmH: number;
  llkH: number;
  /** Magnetizing current swing over the on time, ΔIm = K/(Lm·fs). */
  magnetizingSwingA: number;
  /** Magnetizing current at the start of the on time (0 unipolar; offset − ΔIm/2 bipolar), worst over the line. */
  magnetizingStartA: number;
  /** Largest magnitude of the magnetizing current, max(|start|, |start + ΔIm|): sets the flux peak. */
  magnetizingPeakA: number;
  /** Drain-ring current left at turn-on at Vin min, nom and max (A, unipolar schemes; NaN until the switch is known). */
  ringMinA: number;
  ringNomA: number;
  ringMaxA: number;
  /** Which limit set the design flux swing: core loss or the high-line transient against saturation. */
  fluxLimitedBy: 'loss' | 'transient';
  windowFill: number;
  skinDepthM: number;
  strandAwg: number;
  coreLossW: number;
  /** The flux fall share, K and ΔB the core loss was computed with (it is computed again only when one moves). */
  coreLossFall: number;
  coreLossKV: number;
  coreLossDeltaBT: number;
  /** Transformer windings (primary, secondary and any reset winding). */
  windingCount: number;
  /** Copper of all windings at the design current density (kg). */
  copperMassKg: number;
  /** Price of one winding: the library's labour at the volume plus its share of the copper (0 without a winding entry). */
  windingPrice: number;
  // currents at vinMin, full load
  primaryPeakA: number;
  primaryRmsA: number;
  // reset network (scheme specific, NaN when unused)
  clampV: number;
  resonantPeakV: number;
  resonantCF: number;
  addedCF: number;
  clampResOhm: number;
  clampCapF: number;
  // stress and switches
  switchPeakV: number;
  transientV: number;
  spikeV: number;
  snubberNeeded: boolean;
  switchStressV: number;
  switchRatingV: number;
  mainSwitch: MosfetPart | null;
  mainQty: number;
  mainPrice: number;
  auxSwitch: MosfetPart | null;
  auxPrice: number;
  auxRmsA: number;
  clampDiode: RectifierPart | null;
  clampDiodeQty: number;
  clampDiodePrice: number;
  clampCap: CapacitorPart | null;
  clampCapQty: number;
  clampCapPrice: number;
  clampRes: ResistorPart | null;
  clampResPrice: number;
  snubberDiode: RectifierPart | null;
  snubberDiodePrice: number;
  snubberCap: CapacitorPart | null;
  snubberCapPrice: number;
  snubberCapF: number;
  snubberRes: ResistorPart | null;
  snubberResPrice: number;
  lowSideDrivers: number;
  highSideDrivers: number;
  // totals at nominal input, full load
  lossesW: LossesW;
  efficiency: number;
  bomCost: number;
  partCount: number;
  feasible: boolean;
  score: number;
}
