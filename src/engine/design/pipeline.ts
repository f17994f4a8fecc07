import type { NormalisedSpec } from '../../schemas/spec';
import type { LibraryIndex } from '../parts/index-library';
import { schemeModel } from '../registry';
import type { SchemeId } from '../scheme-ids';
import { subScores, weightedScore } from '../score';
import { costAndCount } from './bom';
import { chooseRectifier, designConversion, designFilter } from './converter';
import { designMagnetics } from './magnetics';
import { efficiencyOf, lossesAt } from './operating-point';
import { designCurrents, designSnubber, designStress } from './stress';
import type { Design } from './types';

function blankDesign(spec: NormalisedSpec, scheme: SchemeId, index: LibraryIndex): Design {
  return {
    scheme, spec, index, poutW: spec.voutV * spec.ioutA, fails: [],
    resetDutyLimit: NaN, dutyLimit: NaN, transientDuty: NaN, resetTurnsRatio: NaN,
    rectifierDropV: NaN, windingDropV: NaN, dropsV: NaN, turnsRatio: NaN, kV: NaN,
    dutyAtVinMin: NaN, dutyAtVinNom: NaN, dutyAtVinMax: NaN,
    rippleA: NaN, outputInductanceH: NaN, outputCapacitanceF: NaN, inductor: null, outCap: null, outCapQty: 0,
    rectForwardV: NaN, rectFreewheelV: NaN, rectDiode: null, rectSr: null, rectQty: 1,
    core: null, turnsPrimary: 0, deltaBT: NaN, bTransientT: NaN, bAvailableT: NaN, lmH: NaN, llkH: NaN,
    magnetizingPeakA: NaN, windowFill: NaN, skinDepthM: NaN, strandAwg: NaN, coreLossW: 0,
    primaryPeakA: NaN, primaryRmsA: NaN,
    clampV: NaN, resonantPeakV: NaN, resonantCF: NaN, addedCF: 0, clampResOhm: NaN, clampCapF: NaN,
    switchPeakV: NaN, transientV: NaN, spikeV: 0, snubberNeeded: false, switchStressV: NaN, switchRatingV: NaN,
    mainSwitch: null, mainQty: 1, auxSwitch: null, auxRmsA: NaN,
    clampDiode: null, clampDiodeQty: 0, clampCap: null, clampCapQty: 0, clampRes: null,
    snubberDiode: null, snubberCap: null, snubberCapF: 0, snubberRes: null,
    lowSideDrivers: 0, highSideDrivers: 0,
    lossesW: { switchConduction: 0, switching: 0, gateDrive: 0, resetOrClamp: 0, rectifiers: 0, transformer: 0, inductor: 0, total: 0 },
    efficiency: NaN, bomCost: 0, partCount: 0, feasible: false, score: 0,
  };
}

/**
 * Design one scheme for a normalised spec: the lean pipeline shared by `evaluate` (which adds
 * findings, trace and efficiency vs load) and `evaluateLean` (sweeps). Stages follow DESIGN.md
 * "The computation" 1–10.
 */
export function designScheme(spec: NormalisedSpec, scheme: SchemeId, index: LibraryIndex): Design {
  const model = schemeModel(scheme);
  const d = blankDesign(spec, scheme, index);
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
    d.lossesW = lossesAt(d, model, spec.vinNomV, 1);
    d.efficiency = efficiencyOf(d.poutW, d.lossesW.total);
  }
  costAndCount(d, model);
  d.feasible = d.fails.length === 0;
  const sub = subScores(spec.vinMaxV, d.switchStressV, d.dutyLimit, d.partCount, d.bomCost, d.efficiency, d.poutW, spec.targetUnitCost, spec.targetEfficiency);
  d.score = Number.isFinite(d.switchStressV) ? weightedScore(sub, spec.weights) : 0;
  return d;
}
