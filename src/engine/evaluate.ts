import { parseSpecInput, type NormalisedSpec, type SpecError } from '../schemas/spec';
import { visitParts } from './design/bom';
import { efficiencyOf, lossesAt, zeroLosses } from './design/operating-point';
import { designBack, designFront, designSchemeInto } from './design/pipeline';
import { copyDesign, newDesign, resetDesign } from './design/record';
import { copySpec, newSpecView } from './design/spec-view';
import type { Design } from './design/types';
import { findingsOf } from './feasibility';
import { indexLibrary, type LibraryIndex } from './parts/index-library';
import { demoPartsLibrary } from './parts/demo-library';
import type { PartsLibrary } from './parts/types';
import { schemeModel } from './registry';
import type { BomLine, Comparison, LeanResult, SchemeResult } from './result-types';
import type { SchemeId } from './scheme-ids';
import { traceOf } from './trace';
import { ENGINE_VERSION } from './version';

/** Thrown by `evaluate` for an invalid requirement set; `errors` name each field and reason. */
export class SpecValidationError extends RangeError {
  readonly errors: SpecError[];
  constructor(errors: SpecError[]) {
    super(errors.map((e) => e.message).join('; '));
    this.name = 'SpecValidationError';
    this.errors = errors;
  }
}

const nullIfNaN = (x: number): number | null => (Number.isFinite(x) ? x : null);
const LOAD_STEPS = [0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1];

const loadLosses = zeroLosses();

/**
 * Full per-scheme result from a design record: adds findings, BOM lines, efficiency vs load and
 * trace, each built once. Copies everything it keeps, so the record may be reused afterwards.
 */
export function resultOf(d: Design): SchemeResult {
  const model = schemeModel(d.scheme);
  const parts: BomLine[] = [];
  visitParts(d, model, (role, part, qty, unitPrice) => parts.push({ role, partId: part.id, qty, unitPrice }));
  const efficiencyVsLoad: { loadFraction: number; efficiency: number }[] = [];
  if (d.core) {
    for (const loadFraction of LOAD_STEPS) {
      const lossW = lossesAt(d, model, d.spec.vinNomV, loadFraction, loadLosses).total;
      efficiencyVsLoad.push({ loadFraction, efficiency: efficiencyOf(d.poutW * loadFraction, lossW) });
    }
  }
  const l = d.lossesW;
  const lossesW = {
    switchConduction: l.switchConduction, switching: l.switching, gateDrive: l.gateDrive, resetOrClamp: l.resetOrClamp,
    rectifiers: l.rectifiers, transformer: l.transformer, inductor: l.inductor, total: l.total,
  };
  return {
    scheme: d.scheme, label: model.label, feasible: d.feasible, findings: findingsOf(d, model),
    turnsRatio: d.turnsRatio, resetTurnsRatio: model.resetWindingRatio(d),
    dutyLimit: d.dutyLimit, duty: { atVinMin: d.dutyAtVinMin, atVinNom: d.dutyAtVinNom, atVinMax: d.dutyAtVinMax },
    switchCount: model.switchCount, switchPeakV: d.switchPeakV, switchStressV: d.switchStressV, switchRatingV: nullIfNaN(d.switchRatingV),
    rectifierReverseV: { forward: d.rectForwardV, freewheel: d.rectFreewheelV },
    clampCapacitorV: nullIfNaN(d.clampV),
    magnetizingPeakA: d.magnetizingPeakA, primaryRmsA: d.primaryRmsA,
    outputInductanceH: d.outputInductanceH, outputCapacitanceF: d.outputCapacitanceF,
    core: { partId: d.core?.id ?? null, turnsPrimary: d.turnsPrimary, deltaBT: d.deltaBT, coreLossW: d.coreLossW },
    lossesW, efficiency: d.efficiency, efficiencyVsLoad,
    partCount: d.partCount, parts, bomCost: d.bomCost, currency: d.index.library.currency, score: d.score,
    details: {
      voltSecondsV: d.kV, dropsV: d.dropsV, leakageDropV: d.leakageDropV, resetDutyLimit: d.resetDutyLimit, transientSwitchV: d.transientV,
      leakageSpikeV: d.spikeV, primaryPeakA: d.primaryPeakA, inductorRippleA: d.rippleA,
      magnetizingInductanceH: d.lmH, leakageInductanceH: d.llkH, transientFluxSwingT: d.bTransientT,
      availableFluxSwingT: d.bAvailableT, windowFill: d.windowFill, skinDepthM: d.skinDepthM, strandAwg: d.strandAwg,
      windingCount: d.windingCount, copperMassKg: d.copperMassKg,
      resonantPeakV: Number.isFinite(d.resonantPeakV) ? Math.max(model.resetVoltageV(d, d.spec.vinMinV), model.resetVoltageV(d, d.spec.vinMaxV)) : null, resonantCapacitanceF: nullIfNaN(d.resonantCF),
      clampResistorOhm: nullIfNaN(d.clampResOhm), clampCapacitanceF: nullIfNaN(d.clampCapF),
      mainSwitchId: d.mainSwitch?.id ?? null, mainSwitchParallel: d.mainQty, rectifierId: (d.rectSr ?? d.rectDiode)?.id ?? null,
    },
    trace: traceOf(d, model),
  };
}

/** Ranking: feasible first, then by score descending, then by the scheme order. */
export function rankResults(results: { scheme: SchemeId; feasible: boolean; score: number }[]): SchemeId[] {
  return [...results].sort((a, b) => Number(b.feasible) - Number(a.feasible) || b.score - a.score).map((r) => r.scheme);
}

// Scratch design records (evaluation is synchronous; results copy what they keep).
let fullScratch: Design | null = null;
let leanScratch: Design | null = null;
const fullSpec = newSpecView();
const leanSpec = newSpecView();

/** Evaluate a normalised spec (no validation; the fast path for trusted callers). */
export function evaluateNormalised(spec: NormalisedSpec, library: PartsLibrary = demoPartsLibrary): Comparison {
  const index = indexLibrary(library);
  const view = copySpec(fullSpec, spec);
  const results: SchemeResult[] = [];
  for (const id of spec.schemes) {
    fullScratch ??= newDesign(view, id, index);
    results.push(resultOf(designSchemeInto(fullScratch, view, id, index)));
  }
  return {
    engineVersion: ENGINE_VERSION, input: spec, results, ranking: rankResults(results),
    partsLibrary: { name: library.name, version: library.version, currency: library.currency, demo: library.demo === true },
  };
}

/**
 * Evaluate a requirement set for every requested reset scheme. Raw input is validated with the
 * shared schema; invalid input throws SpecValidationError (a RangeError) listing each problem.
 */
export function evaluate(input: unknown, library: PartsLibrary = demoPartsLibrary): Comparison {
  const parsed = parseSpecInput(input);
  if (!parsed.ok) throw new SpecValidationError(parsed.errors);
  return evaluateNormalised(parsed.value, library);
}

/** Lean evaluation of one scheme (numbers only; no findings text, waveforms or load sweep). */
export function evaluateLean(spec: NormalisedSpec, scheme: SchemeId, library: PartsLibrary = demoPartsLibrary): LeanResult {
  const index = indexLibrary(library);
  const view = copySpec(leanSpec, spec);
  leanScratch ??= newDesign(view, scheme, index);
  return leanOf(designSchemeInto(leanScratch, view, scheme, index));
}

function leanOf(d: Design): LeanResult {
  return {
    scheme: d.scheme, feasible: d.feasible, turnsRatio: d.turnsRatio, dutyLimit: d.dutyLimit,
    dutyAtVinMin: d.dutyAtVinMin, dutyAtVinMax: d.dutyAtVinMax, switchPeakV: d.switchPeakV,
    switchStressV: d.switchStressV, switchRatingV: d.switchRatingV, rectifierForwardV: d.rectForwardV,
    rectifierFreewheelV: d.rectFreewheelV, lossW: d.lossesW.total, efficiency: d.efficiency,
    bomCost: d.bomCost, partCount: d.partCount, score: d.score,
  };
}

/**
 * `evaluateLean` for a grid walk, in which many points share the stages before the main switch is chosen
 * (conversion, filter, magnetics with the leakage passes, the duty check: they never read the main switch).
 * The caller names, per point, a `slot` and a `key` that together stand for everything those stages read
 * (scheme, spec, duty limit and the other forced parts); a point whose slot holds the same key starts from the
 * kept state instead of computing it again. Results equal `evaluateLean`'s to the last bit (tests/unit/sweep.test.ts).
 */
export class LeanSweeper {
  private readonly index: LibraryIndex;
  private readonly view = newSpecView();
  private readonly keys: Float64Array;
  private readonly kept: (Design | undefined)[];
  private scratch: Design | null = null;

  /** `slots`: how many front states to keep (the caller's slot numbers run from 0 to slots − 1). */
  constructor(readonly library: PartsLibrary, readonly slots: number) {
    this.index = indexLibrary(library);
    this.keys = new Float64Array(slots).fill(NaN);
    this.kept = new Array<Design | undefined>(slots);
  }

  /** Forget every kept state (their records stay, to be overwritten): call it before keys start to mean other points. */
  forget(): void {
    this.keys.fill(NaN);
  }

  // A method on the prototype, not a closure per sweeper: every sweep then calls one and the same function,
  // and the JIT's code for the caller stays valid from one sweep to the next.
  evaluate(spec: NormalisedSpec, scheme: SchemeId, slot: number, key: number): LeanResult {
    const view = copySpec(this.view, spec);
    const index = this.index;
    const d = (this.scratch ??= newDesign(view, scheme, index));
    const held = this.kept[slot];
    if (held && this.keys[slot] === key && held.scheme === scheme) {
      copyDesign(d, held);
      d.spec = view;
      d.ov = view.overrides[scheme];
    } else {
      designFront(resetDesign(d, view, scheme, index));
      this.kept[slot] = copyDesign(held ?? newDesign(view, scheme, index), d);
      this.keys[slot] = key;
    }
    return leanOf(designBack(d));
  }
}
