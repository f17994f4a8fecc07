import type { NormalisedSpec } from '../../schemas/spec';
import { pricesAt, type LibraryIndex } from '../parts/index-library';
import type { SchemeId } from '../scheme-ids';
import { zeroLosses } from './operating-point';
import type { Design, LossesW } from './types';

/**
 * A new, blank design record for one scheme and spec (every field present from the start, so
 * all records share one hidden class).
 */
export function newDesign(spec: NormalisedSpec, scheme: SchemeId, index: LibraryIndex): Design {
  return {
    scheme, spec, index, prices: pricesAt(index, spec.annualVolume), ov: spec.overrides[scheme],
    poutW: spec.voutV * spec.ioutA, fails: [],
    resetDutyLimit: NaN, dutyLimit: NaN, transientDuty: NaN, resetTurnsRatio: NaN,
    rectifierDropV: NaN, windingDropV: NaN, dropsV: NaN, turnsRatio: NaN, kV: NaN, leakageCoefficientV: 0, leakageDropV: 0,
    dutyAtVinMin: NaN, dutyAtVinNom: NaN, dutyAtVinMax: NaN,
    rippleA: NaN, outputInductanceH: NaN, outputCapacitanceF: NaN, inductor: null, inductorPrice: 0, outCap: null, outCapQty: 0, outCapPrice: 0,
    rectForwardV: NaN, rectFreewheelV: NaN, rectDiode: null, rectSr: null, rectQty: 1, rectPrice: 0,
    core: null, corePrice: 0, turnsPrimary: 0, deltaBT: NaN, bTransientT: NaN, bAvailableT: NaN, lmH: NaN, llkH: NaN,
    magnetizingSwingA: NaN, magnetizingStartA: NaN, magnetizingPeakA: NaN, ringMinA: NaN, ringNomA: NaN, ringMaxA: NaN, fluxLimitedBy: 'loss', windowFill: NaN, skinDepthM: NaN, strandAwg: NaN, coreLossW: 0, coreLossFall: NaN, coreLossKV: NaN, coreLossDeltaBT: NaN,
    windingCount: 0, copperMassKg: 0, windingPrice: 0,
    primaryPeakA: NaN, primaryRmsA: NaN,
    clampV: NaN, resonantPeakV: NaN, resonantCF: NaN, addedCF: 0, clampResOhm: NaN, clampCapF: NaN,
    switchPeakV: NaN, transientV: NaN, spikeV: 0, snubberNeeded: false, switchStressV: NaN, switchRatingV: NaN,
    mainSwitch: null, mainQty: 1, mainPrice: 0, auxSwitch: null, auxPrice: 0, auxRmsA: NaN,
    clampDiode: null, clampDiodeQty: 0, clampDiodePrice: 0, clampCap: null, clampCapQty: 0, clampCapPrice: 0,
    clampRes: null, clampResPrice: 0,
    snubberDiode: null, snubberDiodePrice: 0, snubberCap: null, snubberCapPrice: 0, snubberCapF: 0,
    snubberRes: null, snubberResPrice: 0,
    lowSideDrivers: 0, highSideDrivers: 0,
    lossesW: zeroLosses(),
    efficiency: NaN, bomCost: 0, partCount: 0, feasible: false, score: 0,
    };
}

function zeroInto(l: LossesW): void {
  l.switchConduction = 0;
  l.switching = 0;
  l.gateDrive = 0;
  l.resetOrClamp = 0;
  l.rectifiers = 0;
  l.transformer = 0;
  l.inductor = 0;
  l.total = 0;
}

/**
 * Reset a design record in place to the state `newDesign` returns (the same values field by
 * field; tests/unit/engine/record.test.ts checks both agree). Lets a sweep reuse one record
 * instead of allocating ~120 fields per evaluation.
 */
export function resetDesign(d: Design, spec: NormalisedSpec, scheme: SchemeId, index: LibraryIndex): Design {
  d.scheme = scheme;
  d.spec = spec;
  d.index = index;
  d.prices = pricesAt(index, spec.annualVolume);
  d.ov = spec.overrides[scheme];
  d.poutW = spec.voutV * spec.ioutA;
  d.fails.length = 0;
  d.resetDutyLimit = NaN;
  d.dutyLimit = NaN;
  d.transientDuty = NaN;
  d.resetTurnsRatio = NaN;
  d.rectifierDropV = NaN;
  d.windingDropV = NaN;
  d.dropsV = NaN;
  d.turnsRatio = NaN;
  d.kV = NaN;
  d.leakageCoefficientV = 0;
  d.leakageDropV = 0;
  d.dutyAtVinMin = NaN;
  d.dutyAtVinNom = NaN;
  d.dutyAtVinMax = NaN;
  d.rippleA = NaN;
  d.outputInductanceH = NaN;
  d.outputCapacitanceF = NaN;
  d.inductor = null;
  d.inductorPrice = 0;
  d.outCap = null;
  d.outCapQty = 0;
  d.outCapPrice = 0;
  d.rectForwardV = NaN;
  d.rectFreewheelV = NaN;
  d.rectDiode = null;
  d.rectSr = null;
  d.rectQty = 1;
  d.rectPrice = 0;
  d.core = null;
  d.corePrice = 0;
  d.turnsPrimary = 0;
  d.deltaBT = NaN;
  d.bTransientT = NaN;
  d.bAvailableT = NaN;
  d.lmH = NaN;
  d.llkH = NaN;
  d.magnetizingSwingA = NaN;
  d.magnetizingStartA = NaN;
  d.magnetizingPeakA = NaN;
  d.ringMinA = NaN;
  d.ringNomA = NaN;
  d.ringMaxA = NaN;
  d.fluxLimitedBy = 'loss';
  d.windowFill = NaN;
  d.skinDepthM = NaN;
  d.strandAwg = NaN;
  d.coreLossW = 0;
  d.coreLossFall = NaN;
  d.coreLossKV = NaN;
  d.coreLossDeltaBT = NaN;
  d.windingCount = 0;
  d.copperMassKg = 0;
  d.windingPrice = 0;
  d.primaryPeakA = NaN;
  d.primaryRmsA = NaN;
  d.clampV = NaN;
  d.resonantPeakV = NaN;
  d.resonantCF = NaN;
  d.addedCF = 0;
  d.clampResOhm = NaN;
  d.clampCapF = NaN;
  d.switchPeakV = NaN;
  d.transientV = NaN;
  d.spikeV = 0;
  d.snubberNeeded = false;
  d.switchStressV = NaN;
  d.switchRatingV = NaN;
  d.mainSwitch = null;
  d.mainQty = 1;
  d.mainPrice = 0;
  d.auxSwitch = null;
  d.auxPrice = 0;
  d.auxRmsA = NaN;
  d.clampDiode = null;
  d.clampDiodeQty = 0;
  d.clampDiodePrice = 0;
  d.clampCap = null;
  d.clampCapQty = 0;
  d.clampCapPrice = 0;
  d.clampRes = null;
  d.clampResPrice = 0;
  d.snubberDiode = null;
  d.snubberDiodePrice = 0;
  d.snubberCap = null;
  d.snubberCapPrice = 0;
  d.snubberCapF = 0;
  d.snubberRes = null;
  d.snubberResPrice = 0;
  d.lowSideDrivers = 0;
  d.highSideDrivers = 0;
  zeroInto(d.lossesW);
  d.efficiency = NaN;
  d.bomCost = 0;
  d.partCount = 0;
  d.feasible = false;
  d.score = 0;
  return d;
}

/**
 * Copy every field of `from` into `d` (the failure list and losses by value, so the two records share no
 * mutable part) and return `d`. A sweep keeps the state after the front stages and restores it for the
 * next point that shares them; tests/unit/engine/record.test.ts checks that no field is missed.
 */
export function copyDesign(d: Design, from: Design): Design {
  d.fails.length = 0;
  for (const f of from.fails) d.fails.push(f);
  d.scheme = from.scheme;
  d.spec = from.spec;
  d.index = from.index;
  d.prices = from.prices;
  d.ov = from.ov;
  d.poutW = from.poutW;
  d.resetDutyLimit = from.resetDutyLimit;
  d.dutyLimit = from.dutyLimit;
  d.transientDuty = from.transientDuty;
  d.resetTurnsRatio = from.resetTurnsRatio;
  d.rectifierDropV = from.rectifierDropV;
  d.windingDropV = from.windingDropV;
  d.dropsV = from.dropsV;
  d.turnsRatio = from.turnsRatio;
  d.kV = from.kV;
  d.leakageCoefficientV = from.leakageCoefficientV;
  d.leakageDropV = from.leakageDropV;
  d.dutyAtVinMin = from.dutyAtVinMin;
  d.dutyAtVinNom = from.dutyAtVinNom;
  d.dutyAtVinMax = from.dutyAtVinMax;
  d.rippleA = from.rippleA;
  d.outputInductanceH = from.outputInductanceH;
  d.outputCapacitanceF = from.outputCapacitanceF;
  d.inductor = from.inductor;
  d.inductorPrice = from.inductorPrice;
  d.outCap = from.outCap;
  d.outCapQty = from.outCapQty;
  d.outCapPrice = from.outCapPrice;
  d.rectForwardV = from.rectForwardV;
  d.rectFreewheelV = from.rectFreewheelV;
  d.rectDiode = from.rectDiode;
  d.rectSr = from.rectSr;
  d.rectQty = from.rectQty;
  d.rectPrice = from.rectPrice;
  d.core = from.core;
  d.corePrice = from.corePrice;
  d.turnsPrimary = from.turnsPrimary;
  d.deltaBT = from.deltaBT;
  d.bTransientT = from.bTransientT;
  d.bAvailableT = from.bAvailableT;
  d.lmH = from.lmH;
  d.llkH = from.llkH;
  d.magnetizingSwingA = from.magnetizingSwingA;
  d.magnetizingStartA = from.magnetizingStartA;
  d.magnetizingPeakA = from.magnetizingPeakA;
  d.ringMinA = from.ringMinA;
  d.ringNomA = from.ringNomA;
  d.ringMaxA = from.ringMaxA;
  d.fluxLimitedBy = from.fluxLimitedBy;
  d.windowFill = from.windowFill;
  d.skinDepthM = from.skinDepthM;
  d.strandAwg = from.strandAwg;
  d.coreLossW = from.coreLossW;
  d.coreLossFall = from.coreLossFall;
  d.coreLossKV = from.coreLossKV;
  d.coreLossDeltaBT = from.coreLossDeltaBT;
  d.windingCount = from.windingCount;
  d.copperMassKg = from.copperMassKg;
  d.windingPrice = from.windingPrice;
  d.primaryPeakA = from.primaryPeakA;
  d.primaryRmsA = from.primaryRmsA;
  d.clampV = from.clampV;
  d.resonantPeakV = from.resonantPeakV;
  d.resonantCF = from.resonantCF;
  d.addedCF = from.addedCF;
  d.clampResOhm = from.clampResOhm;
  d.clampCapF = from.clampCapF;
  d.switchPeakV = from.switchPeakV;
  d.transientV = from.transientV;
  d.spikeV = from.spikeV;
  d.snubberNeeded = from.snubberNeeded;
  d.switchStressV = from.switchStressV;
  d.switchRatingV = from.switchRatingV;
  d.mainSwitch = from.mainSwitch;
  d.mainQty = from.mainQty;
  d.mainPrice = from.mainPrice;
  d.auxSwitch = from.auxSwitch;
  d.auxPrice = from.auxPrice;
  d.auxRmsA = from.auxRmsA;
  d.clampDiode = from.clampDiode;
  d.clampDiodeQty = from.clampDiodeQty;
  d.clampDiodePrice = from.clampDiodePrice;
  d.clampCap = from.clampCap;
  d.clampCapQty = from.clampCapQty;
  d.clampCapPrice = from.clampCapPrice;
  d.clampRes = from.clampRes;
  d.clampResPrice = from.clampResPrice;
  d.snubberDiode = from.snubberDiode;
  d.snubberDiodePrice = from.snubberDiodePrice;
  d.snubberCap = from.snubberCap;
  d.snubberCapPrice = from.snubberCapPrice;
  d.snubberCapF = from.snubberCapF;
  d.snubberRes = from.snubberRes;
  d.snubberResPrice = from.snubberResPrice;
  d.lowSideDrivers = from.lowSideDrivers;
  d.highSideDrivers = from.highSideDrivers;
  d.efficiency = from.efficiency;
  d.bomCost = from.bomCost;
  d.partCount = from.partCount;
  d.feasible = from.feasible;
  d.score = from.score;
  copyLosses(d.lossesW, from.lossesW);
  return d;
}

function copyLosses(to: LossesW, from: LossesW): void {
  to.switchConduction = from.switchConduction;
  to.switching = from.switching;
  to.gateDrive = from.gateDrive;
  to.resetOrClamp = from.resetOrClamp;
  to.rectifiers = from.rectifiers;
  to.transformer = from.transformer;
  to.inductor = from.inductor;
  to.total = from.total;
}
