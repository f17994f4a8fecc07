import {
  CORE_LOSS_DENSITY_W_PER_M3, CURRENT_DENSITY_A_PER_M2, FLUX_MARGIN, HOT_C, KU_EFFECTIVE,
} from '../assumptions';
import { areaProductM4, forwardApparentPowerW, windingLossW } from '../magnetics/area-product';
import { coreLossDensityWPerM3, peakFluxForLossDensityT } from '../magnetics/steinmetz';
import type { CorePart } from '../parts/types';
import { selectCore } from '../parts/select';
import type { ResetSchemeModel } from '../schemes/types';
import { awgForMaxDiameter, copperResistivity, skinDepthM } from '../wire';
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
  return windingLossW(copperResistivity(HOT_C), core.mltM, at, KU_EFFECTIVE * core.waM2);
}

function fitTurns(d: Design, core: CorePart, model: ResetSchemeModel, deltaBDesignT: number): void {
  const s = d.spec;
  const ov = s.overrides[d.scheme];
  d.core = core;
  d.turnsPrimary = ov?.turnsPrimary ?? Math.max(1, Math.ceil(d.kV / (deltaBDesignT * core.aeM2 * s.fswHz)));
  d.deltaBT = d.kV / (d.turnsPrimary * core.aeM2 * s.fswHz);
  d.bTransientT = (s.vinMaxV * model.transientDuty(d)) / (d.turnsPrimary * core.aeM2 * s.fswHz);
  d.bAvailableT = model.bipolarFlux ? 2 * core.bsatT : core.bsatT - core.brT;
  const at = d.turnsPrimary * ampereTurnsPerTurn(d, d.dutyAtVinMin, s.ioutA, d.rippleA);
  d.windowFill = at / (CURRENT_DENSITY_A_PER_M2 * KU_EFFECTIVE * core.waM2);
}

/**
 * Stage 4: core by area product (McLyman ch. 7 [M]), flux swing limited by core loss and by
 * saturation in a high-line transient, primary turns, Lm from the ungapped AL, Steinmetz core loss.
 */
export function designMagnetics(d: Design, model: ResetSchemeModel): void {
  const s = d.spec;
  const ref = d.index.coresByAp[0];
  if (!ref) { d.fails.push('no-core'); return; }
  const dbLoss = 2 * peakFluxForLossDensityT(ref.steinmetzK, ref.steinmetzAlpha, ref.steinmetzBeta, s.fswHz, CORE_LOSS_DENSITY_W_PER_M3);
  const bAvail = model.bipolarFlux ? 2 * ref.bsatT : ref.bsatT - ref.brT;
  const transientScale = (s.vinMaxV * model.transientDuty(d)) / d.kV;
  const deltaBDesignT = Math.min(dbLoss, (FLUX_MARGIN * bAvail) / transientScale);
  const duty = Math.min(Math.max(d.dutyAtVinMin, 0.05), 0.95);
  const pt = forwardApparentPowerW((s.voutV + d.dropsV) * s.ioutA, duty, 0.9);
  const ap = areaProductM4(duty, pt, KU_EFFECTIVE, deltaBDesignT, CURRENT_DENSITY_A_PER_M2, s.fswHz);
  const forcedId = s.overrides[d.scheme]?.partIds?.core;
  if (forcedId) {
    const core = d.index.byId.get(forcedId) as CorePart | undefined;
    if (!core || !('aeM2' in core)) { d.fails.push('unknown-part'); return; }
    fitTurns(d, core, model, deltaBDesignT);
  } else {
    let core = selectCore(d.index.coresByAp, d.index.coreApM4, ap, s.annualVolume);
    if (!core) {
      // Nothing large enough: carry on with the largest core so every figure stays defined.
      d.fails.push('no-core');
      core = d.index.coresByAp[d.index.coresByAp.length - 1]!;
    }
    for (let tries = 0; core && tries < 4; tries++) {
      fitTurns(d, core, model, deltaBDesignT);
      if (d.windowFill <= 1) break;
      // Windings do not fit: move to the next larger area product.
      core = selectCore(d.index.coresByAp, d.index.coreApM4, core.aeM2 * core.waM2 * (1 + 1e-9), s.annualVolume);
    }
  }
  if (!d.core) { d.fails.push('no-core'); return; }
  const core = d.core!;
  if (d.windowFill > 1) d.fails.push('windings-do-not-fit');
  if (d.bTransientT > d.bAvailableT) d.fails.push('flux-above-saturation');
  d.lmH = core.alH * d.turnsPrimary * d.turnsPrimary;
  d.llkH = s.leakageRatio * d.lmH;
  // Unipolar schemes start from zero each cycle; bipolar ones swing ±ΔIm/2 (derived).
  d.magnetizingPeakA = (model.bipolarFlux ? 0.5 : 1) * d.kV / (d.lmH * s.fswHz);
  d.skinDepthM = skinDepthM(s.fswHz, HOT_C);
  d.strandAwg = awgForMaxDiameter(2 * d.skinDepthM);
  d.coreLossW = core.veM3 * coreLossDensityWPerM3(core.steinmetzK, core.steinmetzAlpha, core.steinmetzBeta, s.fswHz, d.deltaBT / 2);
}
