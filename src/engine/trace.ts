import { CAP_TOLERANCE, CORE_LOSS_DENSITY_W_PER_M3, INTERWINDING_INSULATION_M, WINDING_DROP_SHARE } from './assumptions';
import type { Design } from './design/types';
import type { ResetSchemeModel } from './schemes/types';

/** One input value that went into a figure. */
export interface TraceInput {
  symbol: string;
  value: number;
  unit: string;
}

/** How a key figure was obtained: formula text, the inputs with units, the result and its published source. */
export interface TraceEntry {
  formula: string;
  inputs: TraceInput[];
  value: number;
  unit: string;
  source: string;
}

const i = (symbol: string, value: number, unit: string): TraceInput => ({ symbol, value, unit });

/** Explain map for the Compare screen's hover text, keyed by the result field path. */
export function traceOf(d: Design, model: ResetSchemeModel): Record<string, TraceEntry> {
  const s = d.spec;
  const f = model.formulas;
  const vin = [i('Vin,min', s.vinMinV, 'V'), i('Vin,max', s.vinMaxV, 'V')];
  const t: Record<string, TraceEntry> = {
    dutyLimit: { formula: f.dutyLimit, inputs: [i('reset limit', d.resetDutyLimit, ''), i('maxDuty', s.maxDuty, '')], value: d.dutyLimit, unit: '', source: f.source },
    turnsRatio: {
      formula: 'n = Ns/Np from n·Dlim·Vin,min = (Vout + VF + Vw)·(1 + Llk/Lm) + n²·c, c = Llk·IL,max·fs (leakage)',
      inputs: [i('Vout', s.voutV, 'V'), i('VF', d.rectifierDropV, 'V'), i('Vw', d.windingDropV, 'V'), i('c', d.leakageCoefficientV, 'V'), i('Llk/Lm', d.lmH > 0 ? d.llkH / d.lmH : 0, ''), i('Dlim', d.dutyLimit, ''), i('Vin,min', s.vinMinV, 'V')],
      value: d.turnsRatio, unit: '', source: `derived (volt-second balance on L; Erickson & Maksimović §6.3.4 [M]; leakage volt-seconds Llk·(n·IL,max + ΔIm) derived); Vw = ${WINDING_DROP_SHARE * 100} % of Vout (common practice)`,
    },
    'duty.atVinMin': { formula: 'D = ((Vout + drops)/n + Llk·fs·(n·IL,max + ΔIm))/Vin', inputs: [i('Vout + drops', s.voutV + d.dropsV, 'V'), i('n', d.turnsRatio, ''), i('Vin', s.vinMinV, 'V'), i('Llk', d.llkH, 'H'), i('fs', s.fswHz, 'Hz')], value: d.dutyAtVinMin, unit: '', source: 'derived (volt-second balance; the second term is what the leakage takes: rectifier commutation and the current ramp)' },
    switchPeakV: { formula: `${f.offState}; worst of Vin,min and Vin,max`, inputs: [...vin, i('K = (Vout + drops)/n', d.kV, 'V')], value: d.switchPeakV, unit: 'V', source: f.source },
    switchStressV: {
      formula: `max(peak·(1 + allowance), transient) + spike; transient: ${f.transient}`,
      inputs: [i('peak', d.switchPeakV, 'V'), i('allowance', model.clampAllowance, ''), i('transient', d.transientV, 'V'), i('spike', d.spikeV, 'V')],
      value: d.switchStressV, unit: 'V', source: `${f.source}; spike ≈ Ip·√(Llk/C), snubber-limited to 10 % (derived; common practice)`,
    },
    switchRatingV: { formula: 'cheapest library class with Vds ≥ stress/derating', inputs: [i('stress', d.switchStressV, 'V'), i('derating', s.voltageDerating, '')], value: d.switchRatingV, unit: 'V', source: 'rule of thumb V_rating ≥ V_peak/0.8 (common practice; cf. MIL-DTL-917 Table XIX)' },
    'rectifierReverseV.forward': { formula: f.forwardReverse, inputs: [i('n', d.turnsRatio, ''), ...vin], value: d.rectForwardV, unit: 'V', source: f.source },
    'rectifierReverseV.freewheel': { formula: 'VR(D2) = n·Vin,max', inputs: [i('n', d.turnsRatio, ''), i('Vin,max', s.vinMaxV, 'V')], value: d.rectFreewheelV, unit: 'V', source: 'derived; Mohan, Undeland & Robbins ch. 10 [M]' },
    magnetizingPeakA: {
      formula: model.bipolarFlux ? '|Im|max = |offset| + ΔIm/2, ΔIm = K/(Lm·fs); offset from the reset network’s charge balance (active clamp: −½·Llk·(n·IL,max)²/Vc·fs/(1 − D)), worse end of the line' : 'Im,pk = ΔIm = K/(Lm·fs)',
      inputs: [i('K = (Vout + drops)/n', d.kV, 'V'), i('Lm', d.lmH, 'H'), i('Llk', d.llkH, 'H'), i('fs', s.fswHz, 'Hz'), i('ΔIm', d.magnetizingSwingA, 'A'), i('Im at the start of the on time', d.magnetizingStartA, 'A')],
      value: d.magnetizingPeakA, unit: 'A', source: 'derived (volt-second balance on Lm; charge balance on the clamp capacitor)',
    },
    primaryRmsA: { formula: 'Irms = √(D·(a² + a·b + b²)/3) at Vin,min, a = n·IL,min + Im,start, b = n·IL,max + Im,start + ΔIm', inputs: [i('n', d.turnsRatio, ''), i('D', d.dutyAtVinMin, ''), i('Io', s.ioutA, 'A'), i('ΔIL', d.rippleA, 'A'), i('ΔIm', d.magnetizingSwingA, 'A')], value: d.primaryRmsA, unit: 'A', source: 'derived (rms of a linear ramp: trapezoid plus magnetizing ramp, cross term included)' },
    outputInductanceH: { formula: 'L = (Vout + VF)·(1 − Dmin)/(r·Io·fs), snapped up to E12', inputs: [i('Vout + drops', s.voutV + d.dropsV, 'V'), i('Dmin', d.dutyAtVinMax, ''), i('r', s.rippleRatio, ''), i('Io', s.ioutA, 'A'), i('fs', s.fswHz, 'Hz')], value: d.outputInductanceH, unit: 'H', source: 'Mohan, Undeland & Robbins ch. 7 [M]; IEC 60063:2015 E12' },
    outputCapacitanceF: { formula: `C = ΔIL/(8·fs·ΔVo/2)/(1 − ${CAP_TOLERANCE}), snapped up to E6`, inputs: [i('ΔIL', d.rippleA, 'A'), i('fs', s.fswHz, 'Hz'), i('ΔVo', s.voutRippleV, 'V')], value: d.outputCapacitanceF, unit: 'F', source: 'Mohan, Undeland & Robbins ch. 7 [M]; IEC 60063:2015 E6; half the ripple budget to ESR (common practice)' },
    'details.leakageInductanceH': s.leakageRatio !== null
      ? { formula: 'Llk = (Llk/Lm)·Lm, ratio given in the requirement set', inputs: [i('Llk/Lm', s.leakageRatio, ''), i('Lm', d.lmH, 'H')], value: d.llkH, unit: 'H', source: 'requirement set (override of the estimate from the build)' }
      : {
        formula: `Llk = µ0·Np²·MLT·t/b, t = ${s.windingArrangement === 'interleaved' ? '(2c + (a1 + a2)/3)/4 (interleaved P–S–P)' : 'c + (a1 + a2)/3 (non-interleaved)'}, a1 + a2 = window fill × window height`,
        inputs: [i('Np', d.turnsPrimary, 'turns'), i('MLT', d.core?.mltM ?? NaN, 'm'), i('window fill', d.windowFill, ''), i('Wa', d.core?.waM2 ?? NaN, 'm²'), i('c', INTERWINDING_INSULATION_M, 'm')],
        value: d.llkH, unit: 'H', source: 'McLyman, Transformer and Inductor Design Handbook 3rd ed. ch. 17 [M]; Dowell 1966 [M]; window breadth/height by core family (from memory)',
      },
    'core.turnsPrimary': { formula: 'Np = ⌈Vin·D/(ΔB·Ae·fs)⌉, ΔB limited by core loss and transient saturation', inputs: [i('K = (Vout + drops)/n', d.kV, 'V'), i('Ae', d.core?.aeM2 ?? NaN, 'm²'), i('fs', s.fswHz, 'Hz'), i('Pv target', CORE_LOSS_DENSITY_W_PER_M3, 'W/m³')], value: d.turnsPrimary, unit: 'turns', source: 'Faraday (derived); McLyman ch. 7 area product [M]' },
    'core.deltaBT': { formula: 'ΔB = Vin·D/(Np·Ae·fs)', inputs: [i('K = (Vout + drops)/n', d.kV, 'V'), i('Np', d.turnsPrimary, 'turns'), i('Ae', d.core?.aeM2 ?? NaN, 'm²'), i('fs', s.fswHz, 'Hz')], value: d.deltaBT, unit: 'T', source: 'derived (Faraday); Erickson & Maksimović ch. 15 [M]' },
    'core.coreLossW': { formula: 'P = Ve·W·k·f^α·(ΔB/2)^β, W = 2^α·(d1^(1−α) + d2^(1−α))/((2π)^(α−1)·∫|cos θ|^α dθ) (iGSE; rise d1 = K/Vin,nom, fall d2 = reset time)', inputs: [i('Ve', d.core?.veM3 ?? NaN, 'm³'), i('k', d.core?.steinmetzK ?? NaN, 'W/m³'), i('α', d.core?.steinmetzAlpha ?? NaN, ''), i('β', d.core?.steinmetzBeta ?? NaN, ''), i('ΔB', d.deltaBT, 'T')], value: d.coreLossW, unit: 'W', source: 'improved generalized Steinmetz equation, Venkatachalam, Sullivan, Abdallah & Tacca, IEEE COMPEL 2002; dc bias not modelled' },
    'lossesW.resetOrClamp': { formula: f.resetLoss, inputs: [i('Lm', d.lmH, 'H'), i('Llk', d.llkH, 'H'), i('Ip', d.primaryPeakA, 'A'), i('fs', s.fswHz, 'Hz')], value: d.lossesW.resetOrClamp, unit: 'W', source: f.source },
    efficiency: { formula: 'η = Pout/(Pout + ΣP) at Vin,nom, full load', inputs: [i('Pout', d.poutW, 'W'), i('ΣP', d.lossesW.total, 'W')], value: d.efficiency, unit: '', source: 'definition; loss terms: Mohan, Undeland & Robbins 3rd ed. ch. 2 [M]; Erickson & Maksimović §4.3 [M]; common practice' },
    bomCost: { formula: 'Σ qty·unit price at the annual-volume tier', inputs: [i('annualVolume', s.annualVolume, 'pcs/year'), i('parts', d.partCount, 'pcs')], value: d.bomCost, unit: d.index.library.currency, source: `parts library "${d.index.library.name}" ${d.index.library.version}` },
  };
  if (Number.isFinite(d.clampV)) {
    t.clampCapacitorV = { formula: f.offState, inputs: [...vin, i('K = (Vout + drops)/n', d.kV, 'V')], value: d.clampV, unit: 'V', source: f.source };
  }
  return t;
}
