import type { NormalisedSpec } from '../../schemas/spec';
import type { LibraryIndex } from '../parts/index-library';
import { schemeModel } from '../registry';
import type { SchemeId } from '../scheme-ids';
import { subScores, weightedScore } from '../score';
import { costAndCount } from './bom';
import { chooseRectifier, designConversion, designFilter } from './converter';
import { designMagnetics } from './magnetics';
import { efficiencyOf, lossesAt } from './operating-point';
import { newDesign, resetDesign } from './record';
import { designCurrents, designSnubber, designStress } from './stress';
import type { Design } from './types';

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

function runStages(d: Design): Design {
  const spec = d.spec;
  const model = schemeModel(d.scheme);
  designConversion(d, model);
  d.transientDuty = model.transientDuty(d);
  designFilter(d);
  designMagnetics(d, model);
  if (d.core) {
    designCurrents(d);
    designStress(d, model);
    model.sizeReset(d);
    if (model.restressAfterReset) {
      designStress(d, model);
      chooseRectifier(d, model);
      if (!d.rectSr && !d.rectDiode) d.fails.push('no-rectifier');
    }
    designSnubber(d);
    lossesAt(d, model, spec.vinNomV, 1, d.lossesW);
    d.efficiency = efficiencyOf(d.poutW, d.lossesW.total);
  }
  costAndCount(d, model);
  d.feasible = d.fails.length === 0;
  const sub = subScores(spec.vinMaxV, d.switchStressV, d.dutyLimit, d.partCount, d.bomCost, d.efficiency, d.poutW, spec.targetUnitCost, spec.targetEfficiency);
  d.score = Number.isFinite(d.switchStressV) ? weightedScore(sub, spec.weights) : 0;
  return d;
}
