import {
  CORE_LOSS_DENSITY_W_PER_M3, CURRENT_DENSITY_A_PER_M2, FLUX_MARGIN, HOT_C, INTERWINDING_INSULATION_M, KU_EFFECTIVE,
} from '../assumptions';
import { leakageInductanceH, leakageThicknessM, windowShapeM } from '../magnetics/leakage';
import { areaProductM4, forwardApparentPowerW, windingLossW } from '../magnetics/area-product';
import { coreLossDensityWPerM3, igseWaveformFactor, peakFluxForLossDensityT } from '../magnetics/steinmetz';
import { unitPriceAt } from '../parts/index-library';
import type { CorePart } from '../parts/types';
import { selectCore } from '../parts/select';
import type { ResetSchemeModel } from '../schemes/types';
import { awgForMaxDiameter, COPPER_DENSITY_KG_PER_M3, copperResistivity, skinDepthM } from '../wire';

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
  const at = d.turnsPrimary * ampereTurnsPerTurn(d, d.dutyAtVinMin, s.ioutA, d.rippleA);
  d.windowFill = at / (CURRENT_DENSITY_A_PER_M2 * KU_EFFECTIVE * core.waM2);
}

// One-entry memos of pure functions of the frequency (a sweep point evaluates every scheme at one fs).
const lossFlux = { core: null as CorePart | null, fHz: NaN, deltaBT: NaN };
const skin = { fHz: NaN, depthM: NaN, awg: NaN };

/**
 * Flux swing ΔB at which the iGSE loss density of `core` equals the target: W·k·f^α·(ΔB/2)^β = Pv, so ΔB/2 is the
 * Steinmetz inverse at Pv/W (derived; memo of the last call).
 */
function lossLimitedSwingT(core: CorePart, fHz: number, waveform: number): number {
  if (lossFlux.core !== core || lossFlux.fHz !== fHz) {
    lossFlux.deltaBT = 2 * peakFluxForLossDensityT(core.steinmetzK, core.steinmetzAlpha, core.steinmetzBeta, fHz, CORE_LOSS_DENSITY_W_PER_M3);
    lossFlux.core = core;
    lossFlux.fHz = fHz;
  }
  // (Pv/(W·k·f^α))^(1/β) = (Pv/(k·f^α))^(1/β)·W^(−1/β): the sine form memoised, the waveform applied.
  return lossFlux.deltaBT * Math.pow(waveform, -1 / core.steinmetzBeta);
}

/** iGSE waveform factor of a design's flux at the nominal input: rise in K/Vin,nom, fall in the scheme's reset time. */
function waveformAtNominal(d: Design, model: ResetSchemeModel, alpha: number): number {
  const vin = d.spec.vinNomV;
  const rise = Math.min(1, Math.max(1e-6, d.kV / vin));
  const fall = Math.min(1, Math.max(1e-6, model.fluxFallShare(d, vin)));
  return igseWaveformFactor(alpha, rise, fall);
}

/**
 * Magnetizing current from Lm (derived): swing ΔIm = K/(Lm·fs); unipolar schemes start from zero each period, bipolar
 * ones swing offset ± ΔIm/2 about the dc offset their reset network sets (the active clamp's Cc charge balance),
 * taken at the worse end of the line. The flux peak follows the current peak, so for a bipolar scheme the swing
 * available below ±Bsat shrinks to 2·Bsat·(ΔIm/2)/|Im|max.
 */
function setMagnetizing(d: Design, model: ResetSchemeModel, core: CorePart): void {
  const s = d.spec;
  d.magnetizingSwingA = d.kV / (d.lmH * s.fswHz);
  if (!model.bipolarFlux) {
    d.magnetizingStartA = 0;
    d.magnetizingPeakA = d.magnetizingSwingA;
    d.bAvailableT = core.bsatT - core.brT;
    return;
  }
  const atMin = model.magnetizingOffsetA(d, s.vinMinV);
  const atMax = model.magnetizingOffsetA(d, s.vinMaxV);
  const offset = Math.abs(atMin) >= Math.abs(atMax) ? atMin : atMax;
  const half = d.magnetizingSwingA / 2;
  d.magnetizingStartA = offset - half;
  d.magnetizingPeakA = Math.abs(offset) + half;
  d.bAvailableT = (2 * core.bsatT * half) / d.magnetizingPeakA;
}

/**
 * Primary–secondary leakage from the build of the chosen core (magnetics/leakage.ts, McLyman ch. 17 [M]): the windings
 * fill `windowFill` of the window's height h (their build a1 + a2), the window's breadth b is the family's, and the
 * layers are interleaved or not as the spec says.
 */
function estimatedLeakageH(d: Design, core: CorePart): number {
  const w = windowShapeM(core.waM2, core.shapeFamily);
  const build = Math.min(1, d.windowFill) * w.heightM;
  const t = leakageThicknessM(d.spec.windingArrangement, build, INTERWINDING_INSULATION_M);
  return leakageInductanceH(d.turnsPrimary, core.mltM, t, w.breadthM);
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
 * saturation in a high-line transient, primary turns, Lm from the ungapped AL, the magnetizing current with its offset,
 * core loss by the iGSE.
 */
export function designMagnetics(d: Design, model: ResetSchemeModel): void {
  const s = d.spec;
  const ix = d.index;
  const ref = ix.coresByAp[0];
  if (!ref) { d.fails.push('no-core'); return; }
  const dbLoss = lossLimitedSwingT(ref, s.fswHz, waveformAtNominal(d, model, ref.steinmetzAlpha));
  // A bipolar scheme's offset takes its share of the ±Bsat headroom, but it is not designed around here: the offset
  // comes from the leakage energy (∝ Np²) over Lm (∝ Np²), so its flux grows as Np³ — more turns against it would only
  // feed it. The flux check after the magnetizing current is known (setMagnetizing) flags a design it saturates.
  const bAvail = model.bipolarFlux ? 2 * ref.bsatT : ref.bsatT - ref.brT;
  const transientScale = (s.vinMaxV * model.transientDuty(d)) / d.kV;
  const transientLimitT = (FLUX_MARGIN * bAvail) / transientScale;
  d.fluxLimitedBy = transientLimitT < dbLoss ? 'transient' : 'loss';
  const deltaBDesignT = Math.min(dbLoss, transientLimitT);
  const duty = Math.min(Math.max(d.dutyAtVinMin, 0.05), 0.95);
  const pt = forwardApparentPowerW((s.voutV + d.dropsV) * s.ioutA, duty, 0.9);
  const ap = areaProductM4(duty, pt, KU_EFFECTIVE, deltaBDesignT, CURRENT_DENSITY_A_PER_M2, s.fswHz);
  const forcedId = d.ov?.partIds?.core;
  // A later pass (with the leakage) never moves to a smaller core nor takes turns off the same core:
  // either would cut Llk, and the passes could swing between two choices instead of settling (the
  // core only grows, the flux only falls).
  const prevCore = d.leakageCoefficientV > 0 ? d.core : null;
  const prevTurns = d.turnsPrimary;
  if (forcedId) {
    const core = ix.byId.get(forcedId) as CorePart | undefined;
    if (!core || !('aeM2' in core)) { d.fails.push('unknown-part'); return; }
    fitTurns(d, core, model, deltaBDesignT, core === prevCore ? Math.max(1, prevTurns) : 1);
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
      fitTurns(d, core, model, deltaBDesignT, core === prevCore ? Math.max(1, prevTurns) : 1);
      d.corePrice = prices[c]!;
      if (d.windowFill <= 1) break;
      // Windings do not fit: move to the next larger area product.
      c = selectCore(ix.coresByAp, ix.coreApM4, prices, core.aeM2 * core.waM2 * (1 + 1e-9));
    }
  }
  if (!d.core) { d.fails.push('no-core'); return; }
  const core = d.core;
  if (d.windowFill > 1) d.fails.push('windings-do-not-fit');
  d.lmH = core.alH * d.turnsPrimary * d.turnsPrimary;
  d.llkH = s.leakageRatio !== null ? s.leakageRatio * d.lmH : estimatedLeakageH(d, core);
  setMagnetizing(d, model, core);
  if (d.bTransientT > d.bAvailableT) d.fails.push('flux-above-saturation');
  const sk = skinAt(s.fswHz);
  d.skinDepthM = sk.depthM;
  d.strandAwg = sk.awg;
}

/**
 * Windings and their copper, once the magnetizing current is known: each winding's copper cross-section is its rms
 * ampere-turns over the design current density (the window sizing's own J), so the copper of all of them is
 * ρCu·MLT·(ΣN·I)/J (derived; copper density from IEC 60028). One winding costs the library's labour at the volume plus
 * its share of the copper at the library's price per kilogram.
 */
export function designWindings(d: Design, model: ResetSchemeModel): void {
  const core = d.core;
  d.windingCount = model.windingCount;
  if (!core) return;
  const s = d.spec;
  const at = d.turnsPrimary * ampereTurnsPerTurn(d, d.dutyAtVinMin, s.ioutA, d.rippleA) + model.extraAmpereTurnsA(d);
  d.copperMassKg = (COPPER_DENSITY_KG_PER_M3 * core.mltM * at) / CURRENT_DENSITY_A_PER_M2;
  const w = d.index.winding;
  d.windingPrice = w ? d.prices.windingLabour + (d.copperMassKg * w.copperPricePerKg) / d.windingCount : 0;
}

/**
 * The flux and magnetizing figures of the chosen core and turns for the design's K as it stands: the pipeline calls it
 * when it lands the turns ratio on the duty limit without running the front stages again (design/pipeline.ts); the
 * core loss follows in the back stages.
 */
export function refreshFlux(d: Design, model: ResetSchemeModel): void {
  const core = d.core;
  if (!core) return;
  const s = d.spec;
  d.deltaBT = d.kV / (d.turnsPrimary * core.aeM2 * s.fswHz);
  d.bTransientT = (s.vinMaxV * model.transientDuty(d)) / (d.turnsPrimary * core.aeM2 * s.fswHz);
  setMagnetizing(d, model, core);
}

/**
 * Core loss by the iGSE (Venkatachalam et al. 2002) for the scheme's flux shape at Vin,nom, where the losses are
 * reported. The pipeline sets it again after the reset network is sized, whose clamp voltage sets the RCD's fall time.
 */
export function setCoreLoss(d: Design, model: ResetSchemeModel): void {
  const core = d.core;
  if (!core) return;
  const fall = model.fluxFallShare(d, d.spec.vinNomV);
  // The front stages set it and the back stages ask again: only a reset network that moves the fall time (the RCD
  // clamp's settled voltage) or a landed ratio makes the four powers worth computing twice. A sweep's points that share
  // the front stages share it too.
  if (d.coreLossW > 0 && d.coreLossFall === fall && d.coreLossKV === d.kV && d.coreLossDeltaBT === d.deltaBT) return;
  d.coreLossW = core.veM3 * waveformAtNominal(d, model, core.steinmetzAlpha)
    * coreLossDensityWPerM3(core.steinmetzK, core.steinmetzAlpha, core.steinmetzBeta, d.spec.fswHz, d.deltaBT / 2);
  d.coreLossFall = fall;
  d.coreLossKV = d.kV;
  d.coreLossDeltaBT = d.deltaBT;
}
