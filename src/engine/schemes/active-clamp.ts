import { CLAMP_RIPPLE_RATIO, DUTY_MARGIN, WINDING_CAPACITANCE_F } from '../assumptions';
import { E6, snapUpIn } from '../eseries';
import { rippleAtA, switchDutyAt } from '../design/duty';
import type { Design } from '../design/types';
import { selectMosfet } from '../parts/select';
import { chooseClampCap, hotRdsOhm } from './common';
import { drainCapacitance, GROUNDED_SWITCH } from './netlist-common';
import type { ResetSchemeModel } from './types';
import { SCHEME_LABELS } from '../scheme-ids';

/**
 * Equal-stress duty of the active clamp, Dmax = Vmax/(Vmax + Vmin) at Vmin, which makes
 * Vds(Vmin) = Vds(Vmax) = Vmin + Vmax (derived from Vds = Vin²/(Vin − K), K = Vin·D).
 */
export function equalStressDuty(vinMinV: number, vinMaxV: number): number {
  if (!(vinMinV > 0) || !(vinMaxV >= vinMinV)) throw new RangeError(`need 0 < vinMin ≤ vinMax, got ${vinMinV}, ${vinMaxV}`);
  return vinMaxV / (vinMaxV + vinMinV);
}

/**
 * Duty limit of the active clamp that minimises the switch stress over the input range, within `capDuty` (the
 * controller's limit less the margin). The figure is the switch stress S = Vpk·Irms (Erickson & Maksimović 2nd ed.
 * §6.4.1 [M]): for a fixed output Irms,max = n·Io·√D at Vin,min with n ∝ 1/D, so Irms ∝ 1/√D, and the worst peak is
 * max(Vin,min/(1 − D), Vin,max²/(Vin,max − D·Vin,min)) (Vds = Vin²/(Vin − K), K = D·Vin,min). Both peaks rise with D, so the
 * voltage alone would ask for D → 0 (and a huge current); their product has one minimum. Above the equal-stress duty
 * D* = Vmax/(Vmax + Vmin) the low-line term dominates and Vmin/((1 − D)·√D) only rises (its minimum is at 1/3 < D*); below
 * it the high-line term dominates, Vmax²/((Vmax − D·Vmin)·√D), whose minimum is at D = Vmax/(3·Vmin) (derived: zero of
 * the derivative). So the optimum is D* on a wide range (Vmax ≥ 3·Vmin·D*) and Vmax/(3·Vmin) on a narrow one, where D*
 * would cost a needlessly high voltage (380–400 V: 0.351 and about 600 V instead of 0.513 and 780 V).
 */
export function activeClampDutyLimit(vinMinV: number, vinMaxV: number, capDuty: number): number {
  const star = equalStressDuty(vinMinV, vinMaxV);
  const highLineMinimum = vinMaxV / (3 * vinMinV);
  return Math.min(capDuty, highLineMinimum < star ? highLineMinimum : star);
}

/**
 * Dc offset of the magnetizing current at vinV, from the charge balance of Cc (derived). Cc conducts only in the off
 * time, so the current through it averages zero there. At turn-off the leakage keeps the reflected load current
 * n·IL,max flowing into Cc until the rectifiers have commutated (Llk sees Vc while the shorted secondary holds Lm at 0 V):
 * Q = ½·n·IL,max·tc, tc = Llk·n·IL,max/Vc, so Q = ½·Llk·(n·IL,max)²/Vc. The only other current through Cc is the
 * magnetizing current, whose mean over the off time is therefore −Q/((1 − D)·Ts): Im swings offset ± ΔIm/2 with
 * offset = −Q·fs/(1 − D). The charge the drain-node capacitance takes while the drain rises above Vin (½·C·Vc) would
 * lower Q a little; it is left out, which errs towards the larger peak (checked against ngspice, tests/spice).
 */
function magnetizingOffsetAt(d: Design, vinV: number): number {
  if (!(d.llkH > 0) || !(d.lmH > 0)) return 0;
  const duty = switchDutyAt(d, vinV);
  const vc = clampAt(d, vinV);
  if (!(duty < 1) || !(vc > 0)) return 0;
  const i = d.turnsRatio * (d.spec.ioutA + rippleAtA(d, vinV) / 2);
  return (-(0.5 * d.llkH * i * i) / vc) * d.spec.fswHz / (1 - duty);
}

/** Rms of the clamp switch's current, the magnetizing ramp from its end-of-on-time value back to its start over 1 − D (derived). */
function auxRmsAt(d: Design, vinV: number): number {
  const duty = switchDutyAt(d, vinV);
  const a = magnetizingOffsetAt(d, vinV) + d.magnetizingSwingA / 2;
  const b = a - d.magnetizingSwingA;
  return Math.sqrt((Math.max(0, 1 - duty) * (a * a + a * b + b * b)) / 3);
}

/** Active-clamp off-state voltage Vds = Vin/(1 − D) = Vin²/(Vin − K), U-shaped over line (derived). */
export function activeClampOffStateV(vinV: number, kV: number): number {
  if (!(vinV > kV)) throw new RangeError(`active clamp needs Vin > Vin·D (got Vin ${vinV} V, K ${kV} V)`);
  return (vinV * vinV) / (vinV - kV);
}

/**
 * Clamp voltage with the switch duty D (design/duty.ts): Cc sits across Lm and Llk in series, whose
 * volt-seconds balance over a period, so Vin·D = Vc·(1 − D) and Vc = Vin·D/(1 − D); without leakage
 * D = K/Vin and Vds = Vin + Vc = Vin²/(Vin − K) (derived). Undefined (NaN) when the leakage would push
 * D to 1 or beyond: no switch is chosen for such a design and the duty check flags it.
 */
function clampAt(d: Design, vinV: number): number {
  const duty = switchDutyAt(d, vinV);
  return duty < 1 ? (vinV * duty) / (1 - duty) : NaN;
}

const offStateAt = (d: Design, vinV: number): number => vinV + clampAt(d, vinV);

/**
 * Cc that holds the clamp ripple to CLAMP_RIPPLE_RATIO·Vc at an input voltage. Two charges: the
 * magnetizing current's triangle, ΔVc/Vc = (1 − D)²/(8·Lm·Cc·fs²), and the reflected load current
 * that the leakage keeps flowing into Cc at turn-off until the rectifiers have commutated,
 * ΔQ = ½·Llk·(n·IL,max)²/Vc (derived by charge balance; the second term is what a simulation of
 * the clamp with its leakage shows first).
 */
function clampCapacitanceF(d: Design, vinV: number): number {
  const s = d.spec;
  const duty = switchDutyAt(d, vinV);
  const vc = clampAt(d, vinV);
  const magnetizing = ((1 - duty) * (1 - duty) * vc) / (8 * d.lmH * s.fswHz * s.fswHz);
  const ip = d.turnsRatio * (s.ioutA + rippleAtA(d, vinV) / 2);
  const leakage = d.llkH > 0 ? (0.5 * d.llkH * ip * ip) / vc : 0;
  return (magnetizing + leakage) / (CLAMP_RIPPLE_RATIO * vc);
}

/**
 * Active-clamp forward (high-side: N-FET + Cc across the primary, Vc = Vin·D/(1−D);
 * low-side: P-FET + Cc from drain to ground, Vc = Vin/(1−D)). Both switches see Vin/(1−D);
 * flux is bipolar; energy recycled; volt-second clamp assumed for transients (derived by volt-second balance on Lm and charge balance on Cc).
 */
export const activeClamp: ResetSchemeModel = {
  id: 'active-clamp',
  label: SCHEME_LABELS['active-clamp'],
  switchCount: 2,
  bipolarFlux: true,
  leakageClamped: true,
  seriesSwitches: 1,
  clampAllowance: CLAMP_RIPPLE_RATIO / 2,
  diodeRole: 'clamp-diode',
  capacitorRole: 'clamp-capacitor',
  windingCount: 2,
  extraAmpereTurnsA: () => 0,
  restressAfterReset: false,
  formulas: {
    dutyLimit: 'Dlim minimises S = Vds,max·Irms: Vmax/(Vmax + Vmin), or Vmax/(3·Vmin) where that is lower; ≤ maxDuty − margin',
    offState: 'Vds = Vin/(1 − D) = Vin²/(Vin − Vin·D), worst at either end of the range',
    transient: 'volt-second clamp assumed: D ≤ K/Vin, so the transient equals the steady worst case',
    forwardReverse: 'VR(D1) = n·Vin·D/(1 − D), largest at low line',
    resetLoss: 'P = Iaux,rms²·Rds,aux, Iaux,rms² = (1 − D)·(a² + ab + b²)/3, a, b = offset ± ΔIm/2',
    source: 'derived (volt-second balance on Lm; charge balance on Cc); duty by switch stress, Erickson & Maksimović 2nd ed. §6.4.1 [M]',
  },
  resetDutyLimit: (spec) => spec.maxDuty,
  designDutyLimit: (spec) => activeClampDutyLimit(spec.vinMinV, spec.vinMaxV, spec.maxDuty - DUTY_MARGIN),
  transientDuty: (d) => switchDutyAt(d, d.spec.vinMaxV),
  prepare() {},
  resetVoltageV: clampAt,
  offStateV: offStateAt,
  transientV: (d) => offStateAt(d, d.spec.vinMaxV),
  turnOnV(d, vinV) {
    // Partial ZVS: Lm resonance brings the drain to ≈ Vin, leakage energy takes it lower (derived by energy balance).
    const coss = d.mainSwitch ? d.mainSwitch.cossF * d.mainQty : 0;
    const cEq = 2 * coss + WINDING_CAPACITANCE_F;
    return Math.max(0, vinV - d.magnetizingPeakA * Math.sqrt(d.llkH / cEq));
  },
  sizeReset(d) {
    const s = d.spec;
    const highSide = s.activeClampVariant === 'high-side';
    d.clampV = highSide
      ? Math.max(this.resetVoltageV(d, s.vinMinV), this.resetVoltageV(d, s.vinMaxV))
      : d.switchPeakV;
    d.auxRmsA = auxRmsAt(d, s.vinMaxV);
    const list = highSide ? d.index.nMosfets : d.index.pMosfets;
    const prices = highSide ? d.prices.nMosfets : d.prices.pMosfets;
    const aux = selectMosfet(list, prices, d.switchStressV / s.voltageDerating, d.auxRmsA, d.poutW);
    if (aux >= 0) { d.auxSwitch = list[aux]!; d.auxPrice = prices[aux]!; } else d.fails.push('no-aux-switch');
    const cc = Math.max(clampCapacitanceF(d, s.vinMinV), clampCapacitanceF(d, s.vinMaxV));
    if (Number.isFinite(cc) && cc > 0) {
      d.clampCapF = snapUpIn(cc, E6);
      chooseClampCap(d, d.clampCapF, d.clampV);
    } else d.fails.push('no-clamp-part'); // the duty reaches 1: no clamp voltage to size for
    d.lowSideDrivers = highSide ? 1 : 2;
    d.highSideDrivers = highSide ? 1 : 0;
  },
  spikeLeakageH: () => 0,
  magnetizingOffsetA: magnetizingOffsetAt,
  // Cc resets Lm over the whole off time (derived: volt-seconds on Lm).
  fluxFallShare: (d, vinV) => Math.max(0, 1 - d.kV / vinV),
  // Cc holds Vin·D/(1 − D) across Lm + Llk; Lm itself resets with K over the off time (the rest sits on Llk).
  offShape(d, vinV, tOffS, imEnd) {
    const vOff = this.offStateV(d, vinV);
    const swing = d.magnetizingSwingA;
    return { knots: [0, tOffS], v: () => vOff, im: (x) => imEnd - (swing * x) / tOffS, vLmOff: d.kV / (d.spec.fswHz * tOffS) };
  },
  primaryOffA: (imA) => imA,
  ownFindings: () => [{ severity: 'info', code: 'volt-second-clamp', message: 'assumes a line feed-forward (volt-second) duty clamp; without it a high-line transient overstresses the switch and walks the core' }],
  resetWindingRatio: () => null,
  netlist: {
    switchStage: GROUNDED_SWITCH,
    nodeCapacitance: drainCapacitance,
    resetNetwork(p, n, gate2) {
      const vc = p.duty / (1 - p.duty);
      const cc = p.clampCapacitanceF ?? 1e-6;
      // A lossless clamp never settles its slow Lm–Cc mode (real ones are damped by ESR and Rds(on)): a parallel R–C
      // branch (Rd = √(Lm/Cc), Cd = 4·Cc) damps it without sitting in the path of the fast leakage current at turn-off.
      const rd = Math.sqrt(p.lmH / cc);
      const damping = (ref: string, ic: number): string[] => [`RDC cc cd ${n(rd)}`, `CDC cd ${ref} ${n(4 * cc)} IC=${n(ic)}`];
      return p.activeClampVariant === 'high-side'
        ? [
          '* Active clamp, high-side: clamp switch S2 and Cc across the primary, driven in the off time; Cc with a damping R-C branch',
          'S2 d cc g2 0 SWI', 'DB2 d cc DIDEAL',
          `CC cc in ${n(cc)} IC=${n(p.vinV * vc)}`,
          ...damping('in', p.vinV * vc),
          gate2,
        ]
        : [
          '* Active clamp, low-side: clamp switch S2 and Cc from the drain to ground, driven in the off time; Cc with a damping R-C branch',
          'S2 d cc g2 0 SWI', 'DB2 d cc DIDEAL',
          `CC cc 0 ${n(cc)} IC=${n(p.vinV / (1 - p.duty))}`,
          ...damping('0', p.vinV / (1 - p.duty)),
          gate2,
        ];
    },
    magnetizingTerms: () => '',
    measuresCoreVoltage: true,
  },
  resetLossW(d, vinV) {
    if (!d.auxSwitch) return 0;
    const irms = auxRmsAt(d, vinV);
    return irms * irms * hotRdsOhm(d.auxSwitch.rdsOnOhm, 1);
  },
};
