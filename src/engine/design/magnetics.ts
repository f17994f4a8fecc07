import {
  CORE_LOSS_DENSITY_W_PER_M3, CURRENT_DENSITY_A_PER_M2, FLUX_MARGIN, HOT_C, KU_EFFECTIVE,
} from '../assumptions';
import { areaProductM4, forwardApparentPowerW, windingLossW } from '../magnetics/area-product';
import { coreLossDensityWPerM3, peakFluxForLossDensityT } from '../magnetics/steinmetz';
import { unitPriceAt } from '../parts/index-library';
import type { CorePart } from '../parts/types';
import { selectCore } from '../parts/select';
import type { ResetSchemeModel } from '../schemes/types';
import { awgForMaxDiameter, copperResistivity, skinDepthM } from '../wire';

/** Hot copper resistivity (IEC 60028 / IACS at HOT_C), computed once. */
const RHO_HOT_OHM_M = copperResistivity(HOT_C);
import type { Design } from './types';

/** Primary + secondary ampere-turns (rms) per primary turn at duty D and load current Io (derived). */
export function ampereTurnsPerTurn(d: Design, duty: number, ioA: number, rippleA: number): number {
  const iLrms = Math.sqrt(ioA * ioA + (rippleA * rippleA) / 12);
  return d.turnsRatio * Math.sqrt(duty) * iLrms * 2;
}

/** Winding copper loss (optimal window allocation, hot copper; strands ≤ 2·δ so Rac ≈ Rdc). */
export function copperLossW(d: Design, duty: number, ioA: number, rippleA: number): number {
  const core = d.core;
  if (!core) return 0;
  const at = d.turnsPrimary * ampereTurnsPerTurn(d, duty, ioA, rippleA);
  return windingLossW(RHO_HOT_OHM_M, core.mltM, at, KU_EFFECTIVE * core.waM2);
}

function fitTurns(d: Design, core: CorePart, model: ResetSchemeModel, deltaBDesignT: number, minTurns: number): void {
  const s = d.spec;
  const ov = d.ov;
  d.core = core;
  d.turnsPrimary = ov?.turnsPrimary ?? Math.max(minTurns, Math.ceil(d.kV / (deltaBDesignT * core.aeM2 * s.fswHz)));
  d.deltaBT = d.kV / (d.turnsPrimary * core.aeM2 * s.fswHz);
  d.bTransientT = (s.vinMaxV * model.transientDuty(d)) / (d.turnsPrimary * core.aeM2 * s.fswHz);
  d.bAvailableT = model.bipolarFlux ? 2 * core.bsatT : core.bsatT - core.brT;
  const at = d.turnsPrimary * ampereTurnsPerTurn(d, d.dutyAtVinMin, s.ioutA, d.rippleA);
  d.windowFill = at / (CURRENT_DENSITY_A_PER_M2 * KU_EFFECTIVE * core.waM2);
}

// One-entry memos of pure functions of the frequency (a sweep point evaluates every scheme at one fs).
const lossFlux = { core: null as CorePart | null, fHz: NaN, deltaBT: NaN };
const skin = { fHz: NaN, depthM: NaN, awg: NaN };

/** Flux swing 2·B̂ at which the Steinmetz loss density of `core` equals the target (derived; memo of the last call). */
function lossLimitedSwingT(core: CorePart, fHz: number): number {
  if (lossFlux.core !== core || lossFlux.fHz !== fHz) {
    lossFlux.deltaBT = 2 * peakFluxForLossDensityT(core.steinmetzK, core.steinmetzAlpha, core.steinmetzBeta, fHz, CORE_LOSS_DENSITY_W_PER_M3);
    lossFlux.core = core;
    lossFlux.fHz = fHz;
  }
  return lossFlux.deltaBT;
}

/** Skin depth of hot copper and the thickest AWG strand ≤ 2·δ at `fHz` (memo of the last call). */
function skinAt(fHz: number): typeof skin {
  if (skin.fHz !== fHz) {
    skin.depthM = skinDepthM(fHz, HOT_C);
    skin.awg = awgForMaxDiameter(2 * skin.depthM);
    skin.fHz = fHz;
  }
  return skin;
}

/**
 * Stage 4: core by area product (McLyman ch. 7 [M]), flux swing limited by core loss and by
 * saturation in a high-line transient, primary turns, Lm from the ungapped AL, Steinmetz core loss.
 */
export function designMagnetics(d: Design, model: ResetSchemeModel): void {
  const s = d.spec;
  const ix = d.index;
  const ref = ix.coresByAp[0];
  if (!ref) { d.fails.push('no-core'); return; }
  const dbLoss = lossLimitedSwingT(ref, s.fswHz);
  const bAvail = model.bipolarFlux ? 2 * ref.bsatT : ref.bsatT - ref.brT;
  const transientScale = (s.vinMaxV * model.transientDuty(d)) / d.kV;
  const deltaBDesignT = Math.min(dbLoss, (FLUX_MARGIN * bAvail) / transientScale);
  const duty = Math.min(Math.max(d.dutyAtVinMin, 0.05), 0.95);
  const pt = forwardApparentPowerW((s.voutV + d.dropsV) * s.ioutA, duty, 0.9);
  const ap = areaProductM4(duty, pt, KU_EFFECTIVE, deltaBDesignT, CURRENT_DENSITY_A_PER_M2, s.fswHz);
  const forcedId = d.ov?.partIds?.core;
  // A later pass (with the leakage) never moves to a smaller core nor takes turns off the same core:
  // either would cut Llk, and the passes could swing between two choices instead of settling (the
  // core only grows, the flux only falls).
  const prevCore = d.leakageCoefficientV > 0 ? d.core : null;
  const prevTurns = d.turnsPrimary;
  const minTurns = (core: CorePart): number => (core === prevCore ? Math.max(1, prevTurns) : 1);
  if (forcedId) {
    const core = ix.byId.get(forcedId) as CorePart | undefined;
    if (!core || !('aeM2' in core)) { d.fails.push('unknown-part'); return; }
    fitTurns(d, core, model, deltaBDesignT, minTurns(core));
    d.corePrice = unitPriceAt(core.tiers, s.annualVolume);
  } else {
    const prices = d.prices.coresByAp;
    let c = selectCore(ix.coresByAp, ix.coreApM4, prices, ap);
    const floor = prevCore ? ix.coresByAp.indexOf(prevCore) : -1;
    if (c >= 0 && c < floor) c = floor;
    if (c < 0) {
      // Nothing large enough: carry on with the largest core so every figure stays defined.
      d.fails.push('no-core');
      c = ix.coresByAp.length - 1;
    }
    for (let tries = 0; c >= 0 && tries < 4; tries++) {
      const core = ix.coresByAp[c]!;
      fitTurns(d, core, model, deltaBDesignT, minTurns(core));
      d.corePrice = prices[c]!;
      if (d.windowFill <= 1) break;
      // Windings do not fit: move to the next larger area product.
      c = selectCore(ix.coresByAp, ix.coreApM4, prices, core.aeM2 * core.waM2 * (1 + 1e-9));
    }
  }
  if (!d.core) { d.fails.push('no-core'); return; }
  const core = d.core;
  if (d.windowFill > 1) d.fails.push('windings-do-not-fit');
  if (d.bTransientT > d.bAvailableT) d.fails.push('flux-above-saturation');
  d.lmH = core.alH * d.turnsPrimary * d.turnsPrimary;
  d.llkH = s.leakageRatio * d.lmH;
  // Unipolar schemes start from zero each cycle; bipolar ones swing ±ΔIm/2 (derived).
  d.magnetizingPeakA = (model.bipolarFlux ? 0.5 : 1) * d.kV / (d.lmH * s.fswHz);
  const sk = skinAt(s.fswHz);
  d.skinDepthM = sk.depthM;
  d.strandAwg = sk.awg;
  d.coreLossW = core.veM3 * coreLossDensityWPerM3(core.steinmetzK, core.steinmetzAlpha, core.steinmetzBeta, s.fswHz, d.deltaBT / 2);
}
