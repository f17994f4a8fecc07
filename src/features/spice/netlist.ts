import { schemeModel } from '../../engine/registry';
import { isHazardous } from '../../lib/safety';
import type { NetlistPoint } from './operating-point';

/** Context printed in the header (names only; no figures come from here). */
export interface NetlistContext {
  specName: string;
  engineVersion: string;
  libraryName: string;
}

/** Thermal voltage at 27 °C (k·T/q), the temperature the netlist sets with `.options TEMP=27`. */
const VT_27C = 0.025865;
/** Ratio IS/I at the full-load current for the rectifier model (keeps reverse leakage negligible). */
const IS_PER_AMP = 1e-12;

/** SPICE number: six significant digits in exponent form (ngspice reads `4.7e-06`). */
export function spiceNumber(x: number): string {
  if (!Number.isFinite(x)) throw new RangeError(`netlist value must be finite, got ${x}`);
  return Number(x.toPrecision(6)).toExponential();
}

/**
 * Diode emission coefficient N so that the diode drops `vfV` at `iA` with IS = 1e-12·iA
 * (Shockley: V = N·VT·ln(I/IS); common practice for an idealised drop).
 */
export function emissionFor(vfV: number): number {
  return Math.max(vfV, 0.01) / (VT_27C * Math.log(1 / IS_PER_AMP));
}

/** Dead time of the active clamp's complementary drive at each edge, share of the period (0.5 %: 33 ns at 150 kHz). */
const CLAMP_DEAD_TIME_SHARE = 0.005;
/** Share of the rectifier's full-load drop taken by its series resistance RS (the rest by the junction). */
const RECTIFIER_RS_SHARE = 0.1;
/** Junction capacitance of the rectifier and clamp diode models: small, there to give every node a path (F). */
const RECTIFIER_CJO_F = 10e-12;
const CLAMP_DIODE_CJO_F = 1e-12;

/**
 * Rectifier model: the full-load drop `vfV` at `iA`, RECTIFIER_RS_SHARE of it in RS, the rest in the junction
 * (N from `emissionFor`), and a small junction capacitance. A diode with series resistance and capacitance keeps the
 * simulator's time step from collapsing when the diode turns off with current still in a leakage inductance.
 */
export function rectifierModel(vfV: number, iA: number): string {
  const rs = (RECTIFIER_RS_SHARE * vfV) / iA;
  return `.model DRECT D(IS=${spiceNumber(IS_PER_AMP * iA)} N=${spiceNumber(emissionFor((1 - RECTIFIER_RS_SHARE) * vfV))} RS=${spiceNumber(rs)} CJO=${spiceNumber(RECTIFIER_CJO_F)})`;
}

/** Timing of the transient run: settle the output filter (5 time constants) plus a measuring window. */
export function runTiming(p: NetlistPoint): { periodS: number; stopS: number; fromS: number; maxStepS: number } {
  const periodS = 1 / p.fswHz;
  const rLoad = p.voutV / p.ioutA;
  // Envelope of the LC filter with its load: 2RC when underdamped, L/R when overdamped (derived).
  const tauS = Math.max(2 * rLoad * p.outputCapacitanceF, p.outputInductanceH / rLoad);
  const periods = Math.min(4000, Math.ceil((5 * tauS) / periodS) + 30);
  return { periodS, stopS: periods * periodS, fromS: (periods - 10) * periodS, maxStepS: periodS / 200 };
}

const leakageNote = {
  none: 'no leakage: the output is higher by what the leakage would take',
  primary: 'leakage as a series inductor in the primary loop',
} as const;

/**
 * Plain ngspice-compatible netlist of one scheme at one input voltage: ideal switches driven by
 * PULSE sources at the engine's duty and frequency, coupled inductors for the transformer (unity
 * coupling: the leakage allowances are the engine's own, not simulated), the scheme's reset
 * parts, rectifiers, output L and C, the load, a `.tran` long enough to settle and `.meas` lines.
 */
export function buildNetlist(p: NetlistPoint, ctx: NetlistContext): string {
  const n = spiceNumber;
  const t = runTiming(p);
  const tr = t.periodS / 1000;
  const tOn = p.duty * t.periodS;
  const model = schemeModel(p.scheme).netlist;
  // Leakage (the engine's Llk, all of it on the primary side as the engine takes it), which takes volt-seconds from every
  // on time. Where the reset network clamps the leakage energy (RCD, active clamp, two-switch) it sits in series with the
  // primary inside the clamp loop; in the resonant reset it rings with Cr, damped; the tertiary's bifilar reset winding
  // shares it and returns its energy (resetNetwork).
  const leakage = !(p.llkH > 0) ? 'none' : 'primary';
  const top = leakage === 'primary' ? 'pa' : model.switchStage.top;
  // The clamp switch is driven in the off time with a dead time at each edge, as a complementary drive has: the drain
  // swings through its transitions on the body diodes instead of both switches changing at one instant, which also keeps
  // the simulator from stepping through a singular moment.
  const dead = t.periodS * CLAMP_DEAD_TIME_SHARE;
  const gate2 = `VG2 g2 0 PULSE(0 1 ${n(tOn + dead)} ${n(tr)} ${n(tr)} ${n(t.periodS - tOn - 2 * dead - tr)} ${n(t.periodS)})`;
  const rWinding = p.windingDropV / p.ioutA;
  // Start at the beginning of an on time, near the steady state: inductor at its valley, D1 carrying it, and the
  // magnetizing current at its start value (flux linkage consistent across the coupled windings, so no start-up kick).
  const ilMinA = p.ioutA - p.expected.inductorRippleA / 2;
  // Hazardous where the input or the switch node exceeds the safety extra-low voltage.
  const safety = isHazardous(Math.max(p.vinV, p.expected.switchPeakV)) ? ['* CAUTION: hazardous voltage. Isolation and creepage/clearance per the applicable safety standard (e.g. IEC 62368-1);',
    '* defer to local codes and qualified engineers.'] : [];
  const lines = [
    `* Resetwise SPICE netlist - ${p.label} forward converter, ${ctx.specName}`,
    `* Operating point: Vin = ${n(p.vinV)} V (${p.vinCase}), Vout = ${n(p.voutV)} V, Iout = ${n(p.ioutA)} A, fs = ${n(p.fswHz)} Hz, D = ${p.duty.toFixed(4)}`,
    `* Transformer: n = Ns/Np = ${n(p.turnsRatio)}, Lm = ${n(p.lmH)} H (primary); output L = ${n(p.outputInductanceH)} H, C = ${n(p.outputCapacitanceF)} F`,
    `* Engine ${ctx.engineVersion} at this input: switch peak ${n(p.expected.switchPeakV)} V, output ${n(p.expected.voutV)} V, inductor ripple ${n(p.expected.inductorRippleA)} A p-p`,
    `* Parts library: ${ctx.libraryName}`,
    `* Idealised models: ideal switches with their Co(er), unity-coupled windings (${leakageNote[leakage]}), diodes with the`,
    '* full-load drop, a small series resistance and junction capacitance and no recovery, lossless L and C.',
    '* Early trade-off only; verify the final design on the bench.',
    ...safety,
    '.options TEMP=27 TNOM=27 METHOD=GEAR',
    '.model SWI SW(VT=0.5 VH=0 RON=1e-3 ROFF=1e7)',
    rectifierModel(p.rectifierDropV, p.ioutA),
    `.model DIDEAL D(IS=1e-12 N=${n(emissionFor(0.03))} RS=1e-3 CJO=${n(CLAMP_DIODE_CJO_F)})`,
    `VIN in 0 DC ${n(p.vinV)}`,
    `VG1 g1 0 PULSE(0 1 0 ${n(tr)} ${n(tr)} ${n(tOn - tr)} ${n(t.periodS)})`,
    '* Main switch(es) with body diodes',
    ...model.switchStage.lines,
    '* Transformer (dots on the first node)',
    `LP ${top} d ${n(p.lmH)} IC=${n(p.magnetizingStartA + p.turnsRatio * ilMinA)}`,
    `LS sa 0 ${n(p.lmH * p.turnsRatio * p.turnsRatio)} IC=${n(-ilMinA)}`,
    'K1 LP LS 1',
    ...(leakage === 'primary' ? [`* Leakage inductance Llk = ${n(p.llkH)} H in series with the primary`,
      `LLK ${model.switchStage.top} pa ${n(p.llkH)} IC=${n(p.magnetizingStartA + p.turnsRatio * ilMinA)}`] : []),
    ...model.nodeCapacitance(p, n, top),
    ...model.resetNetwork(p, n, gate2),
    '* Forward and freewheeling rectifiers, output filter (winding/layout drop as a series resistance), load',
    'D1 sa sw DRECT', 'D2 0 sw DRECT',
    `LOUT sw lx ${n(p.outputInductanceH)} IC=${n(ilMinA)}`,
    'VIL lx lw DC 0',
    `RW lw out ${n(rWinding)}`,
    `COUT out 0 ${n(p.outputCapacitanceF)} IC=${n(p.voutV)}`,
    `RLOAD out 0 ${n(p.voutV / p.ioutA)}`,
    `.tran ${n(t.maxStepS)} ${n(t.stopS)} 0 ${n(t.maxStepS)} UIC`,
    `.meas tran vsw_pk MAX v(d) FROM=${n(t.fromS)} TO=${n(t.stopS)}`,
    `.meas tran vout_avg AVG v(out) FROM=${n(t.fromS)} TO=${n(t.stopS)}`,
    `.meas tran il_max MAX i(VIL) FROM=${n(t.fromS)} TO=${n(t.stopS)}`,
    `.meas tran il_min MIN i(VIL) FROM=${n(t.fromS)} TO=${n(t.stopS)}`,
    ".meas tran il_ripple PARAM='il_max-il_min'",
    '* Magnetizing current referred to the primary: the winding currents weighted by their turns',
    `BIM im 0 V=i(LP)+${n(p.turnsRatio)}*i(LS)${model.magnetizingTerms(p, n)}`,
    `.meas tran im_max MAX v(im) FROM=${n(t.fromS)} TO=${n(t.stopS)}`,
    `.meas tran im_min MIN v(im) FROM=${n(t.fromS)} TO=${n(t.stopS)}`,
    ...(leakage === 'primary' && model.measuresCoreVoltage
      ? ['* The drain less the drop across the leakage: the voltage the core resets at, Vin + V(Lm)',
        'BCORE vcore 0 V=v(in)+v(d)-v(pa)', `.meas tran vcore_pk MAX v(vcore) FROM=${n(t.fromS)} TO=${n(t.stopS)}`]
      : []),
    '.end',
  ];
  return lines.join('\n') + '\n';
}
