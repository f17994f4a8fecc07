import type { NormalisedSpec } from '../../schemas/spec';
import type { LibraryIndex } from '../parts/index-library';
import { schemeModel } from '../registry';
import type { SchemeId } from '../scheme-ids';
import { subScores, weightedScore } from '../score';
import { costAndCount } from './bom';
import { chooseRectifier, designConversion, designFilter, setRectifierVoltages } from './converter';
import { designMagnetics, designWindings, refreshFlux, setCoreLoss } from './magnetics';
import { efficiencyOf, lossesAt } from './operating-point';
import { newDesign, resetDesign } from './record';
import { leakageCoefficientV, leakageShare, leakageVoltSecondsV, rippleAtA, switchDutyAt, turnsRatioWithLeakage } from './duty';
import { designCurrents, designSnubber, designStress, settleMagnetizing } from './stress';
import type { Design } from './types';
import type { ResetSchemeModel } from '../schemes/types';

/**
 * Design one scheme for a normalised spec: the lean pipeline shared by `evaluate` (which adds
 * findings, trace and efficiency vs load) and `evaluateLean` (sweeps). Stages: conversion,
 * filter, magnetics, currents, stress, reset network, snubber, losses, cost, score.
 */
export function designScheme(spec: NormalisedSpec, scheme: SchemeId, index: LibraryIndex): Design {
  return runStages(newDesign(spec, scheme, index));
}

/**
 * `designScheme` into an existing record (reset first): the allocation-free form for sweeps and
 * for the full evaluation, which copies what it keeps. The record is overwritten by the next call.
 */
export function designSchemeInto(d: Design, spec: NormalisedSpec, scheme: SchemeId, index: LibraryIndex): Design {
  return runStages(resetDesign(d, spec, scheme, index));
}

/** Switch duty at the three lines (effective duty plus the commutation time; design/duty.ts). */
function setSwitchDuties(d: Design): void {
  const s = d.spec;
  d.dutyAtVinMin = switchDutyAt(d, s.vinMinV);
  d.dutyAtVinNom = switchDutyAt(d, s.vinNomV);
  d.dutyAtVinMax = switchDutyAt(d, s.vinMaxV);
}

/** Conversion, filter and magnetics: the stages that depend on the leakage through n. */
function frontStages(d: Design, model: ResetSchemeModel): void {
  designConversion(d, model);
  d.transientDuty = model.transientDuty(d);
  designFilter(d);
  setSwitchDuties(d);
  designMagnetics(d, model);
}

/**
 * Passes after the first are repeated while c = Llk·IL,max·fs moves by more than this share (Llk depends on Np, the core
 * and the window fill). The turns ratio is landed on the duty limit afterwards, so this only decides how settled the
 * discrete choices are: 3 % of c moves the ratio by well under 0.1 %.
 */
export const LEAKAGE_SETTLE = 3e-2;

/**
 * Relative step above the found leakage coefficient when the turns ratio is landed on the limit: a little above, so that
 * the duty lands at or below it although the ripple, and with it c, moves a hair with the ratio; the duty then sits
 * below the limit by about this share of the leakage term (~1e-8).
 */
const TRIM_SHARE = 1e-6;

/** Most solves when landing (c moves with the ratio only through the ripple: each solve cuts the excess ten- to a hundredfold). */
const LAND_STEPS = 12;

/**
 * Solve the turns ratio at the limit with the design's own Llk, Lm and L as they stand (design/duty.ts), a hair above
 * the found c so the duty lands at or below the limit, and refresh what follows K directly (the flux and magnetizing
 * figures). The discrete choices (core, turns, the E12 inductor) and the leakage estimate keep their last pass: the
 * ratio moves by at most the 3 % the passes leave of the leakage's share of the duty, so they stay the ones the design
 * needs (another front pass per design would cost more than all of this; the estimated leakage moves with the ratio
 * through the window fill, so such passes creep rather than settle). A design with no such ratio keeps its duty, and
 * the check below flags it.
 */
function landOnLimit(d: Design, model: ResetSchemeModel): void {
  const s = d.spec;
  for (let k = 0; k < LAND_STEPS && d.dutyAtVinMin > d.dutyLimit; k++) {
    const c = leakageCoefficientV(d, s.vinMinV) * (1 + TRIM_SHARE);
    const n = turnsRatioWithLeakage(s.voutV + d.dropsV, leakageShare(d), c, d.dutyLimit, s.vinMinV);
    if (!Number.isFinite(n)) return;
    d.turnsRatio = n;
    d.kV = (s.voutV + d.dropsV) / n;
    d.rippleA = rippleAtA(d, s.vinMaxV);
    setSwitchDuties(d);
  }
  d.transientDuty = model.transientDuty(d);
  refreshFlux(d, model);
}

function runStages(d: Design): Design {
  return designBack(designFront(d));
}

/**
 * The stages before the main switch is chosen: conversion, filter and magnetics, repeated with the leakage,
 * then the switch duties and the duty check. Nothing here reads the main switch (it is picked in designStress),
 * so grid points that differ only in it share this state (see `LeanSweeper` in evaluate.ts).
 */
export function designFront(d: Design): Design {
  const spec = d.spec;
  const model = schemeModel(d.scheme);
  frontStages(d, model);
  // Once Llk is known, redesign with the volt-seconds the leakage takes (design/duty.ts). Usually one
  // or two more passes settle c; when a discrete choice (core, turns, an E12 inductor) keeps moving
  // it, later passes only let c grow, which ends the passes and errs towards a larger turns ratio.
  for (let pass = 0; pass < 6 && d.core; pass++) {
    const found = leakageCoefficientV(d, spec.vinMinV);
    const c = pass < 2 ? found : Math.max(found, d.leakageCoefficientV);
    if (!(c > 0) || Math.abs(c - d.leakageCoefficientV) <= LEAKAGE_SETTLE * c) break;
    // When the leakage alone would fill the on time at Vin,min no redesign can help; the duty check below flags it.
    if (d.kV + leakageVoltSecondsV(d, spec.vinMinV) >= spec.vinMinV) break;
    d.leakageCoefficientV = c;
    d.fails.length = 0;
    frontStages(d, model);
  }
  setSwitchDuties(d);
  // The passes stop once c has settled to 3 %, so the duty at Vin,min can still sit a little above the limit (by up to
  // 3 % of the leakage share): land the turns ratio on it with the leakage the design now has.
  if (d.core && !d.ov?.turnsRatio && d.dutyAtVinMin > d.dutyLimit) landOnLimit(d, model);
  const leakageAtMinV = leakageVoltSecondsV(d, spec.vinMinV);
  d.leakageDropV = d.turnsRatio * leakageAtMinV;
  // The reverse voltages were set before the last pass's leakage was known: set them from the settled design (a design
  // whose duty cannot be reached keeps those of its passes, which stay defined).
  if (d.dutyAtVinMin <= d.dutyLimit) setRectifierVoltages(d, model);
  else {
    // No turns ratio at all reaches the output once the leakage takes its share: say so rather than "raise n".
    const c = leakageCoefficientV(d, spec.vinMinV);
    const noRatio = !d.ov?.turnsRatio && c > 0 && !Number.isFinite(turnsRatioWithLeakage(spec.voutV + d.dropsV, leakageShare(d), c, d.dutyLimit, spec.vinMinV));
    d.fails.push(noRatio ? 'leakage-commutation' : 'duty-cannot-reach-output');
  }
  setCoreLoss(d, model);
  return d;
}

/** The stages from the main switch on: currents, stress, reset network, snubber, losses, cost, score. */
export function designBack(d: Design): Design {
  const spec = d.spec;
  const model = schemeModel(d.scheme);
  if (d.core) {
    designCurrents(d, model);
    designStress(d, model);
    settleMagnetizing(d, model);
    model.sizeReset(d);
    setCoreLoss(d, model);
    designWindings(d, model);
    if (model.restressAfterReset) {
      designStress(d, model);
      chooseRectifier(d, model);
      if (!d.rectSr && !d.rectDiode) d.fails.push('no-rectifier');
    }
    designSnubber(d, model);
    lossesAt(d, model, spec.vinNomV, 1, d.lossesW);
    d.efficiency = efficiencyOf(d.poutW, d.lossesW.total);
  }
  costAndCount(d, model);
  d.feasible = d.fails.length === 0;
  const sub = subScores(spec.vinMaxV, d.switchStressV, d.dutyLimit, d.partCount, d.bomCost, d.efficiency, d.poutW, spec.targetUnitCost, spec.targetEfficiency);
  d.score = Number.isFinite(d.switchStressV) ? weightedScore(sub, spec.weights) : 0;
  return d;
}
