import {
  CONTROLLER_MIN_ON_TIME_S, EFFICIENCY_FLOOR, LEADING_EDGE_BLANKING_S, MIN_ON_TIME_S, SMALL_MARGIN_SHARE, STEINMETZ_FIT_MAX_HZ, STEINMETZ_FIT_MIN_HZ,
} from './assumptions';
import type { Design, FailCode } from './design/types';
import type { Finding } from './finding';
import type { ResetSchemeModel } from './schemes/types';

/** One finding on a scheme: `fail` makes it infeasible; `warn` is a near-limit; `info` a note. */
export type { Finding } from './finding';

const f1 = (x: number): string => (Number.isFinite(x) ? x.toFixed(1) : String(x));
const f3 = (x: number): string => (Number.isFinite(x) ? x.toFixed(3) : String(x));
const pct = (x: number): string => `${(100 * x).toFixed(1)} %`;

function failMessage(code: FailCode, d: Design): string {
  const s = d.spec;
  switch (code) {
    case 'duty-limit-above-reset': return `duty limit ${f3(d.dutyLimit)} is above the reset limit ${f3(d.resetDutyLimit)}: the core would not reset and walks into saturation`;
    case 'duty-cannot-reach-output': return d.dutyAtVinMin >= 1
      ? `the output is not reachable at ${s.vinMinV} V: with turns ratio ${f3(d.turnsRatio)} even a switch that never turned off would not give ${s.voutV} V (the limit is ${f3(d.dutyLimit)}): raise the turns ratio or the input minimum`
      : `at ${s.vinMinV} V the output needs duty ${f3(d.dutyAtVinMin)}, above the limit ${f3(d.dutyLimit)}: raise the turns ratio or the input minimum`;
    case 'no-switch-for-stress': return `no MOSFET in the library is rated for ${f1(d.switchStressV)} V stress at ${pct(s.voltageDerating)} derating (needs ${f1(d.switchStressV / s.voltageDerating)} V)`;
    case 'no-aux-switch': return `no ${s.activeClampVariant === 'low-side' ? 'P-channel' : 'N-channel'} clamp switch in the library is rated for ${f1(d.switchStressV / s.voltageDerating)} V`;
    case 'no-rectifier': return `no ${s.rectifier === 'synchronous' ? 'synchronous-rectifier MOSFET' : 'rectifier'} in the library blocks ${f1(Math.max(d.rectForwardV, d.rectFreewheelV) / s.voltageDerating)} V at ${f1(s.ioutA)} A`;
    case 'no-core': return 'no core in the library has the area product this design needs';
    case 'windings-do-not-fit': return `the windings need ${pct(d.windowFill)} of the usable window of ${d.core?.id ?? 'the core'}`;
    case 'flux-above-saturation': return d.magnetizingPeakA > 0.5 * d.magnetizingSwingA * 1.05 && d.magnetizingStartA < 0
      ? `a high-line transient drives the flux swing to ${f3(d.bTransientT)} T, above the ${f3(d.bAvailableT)} T left once the magnetizing current's dc offset (${f3(d.magnetizingStartA + d.magnetizingSwingA / 2)} A, from the leakage energy the reset returns) has taken its share: the core saturates; less leakage (interleaved windings) or a gapped core would lower the offset`
      : `a high-line transient drives the flux swing to ${f3(d.bTransientT)} T, above the available ${f3(d.bAvailableT)} T: the core saturates`;
    case 'resonant-reset-incomplete': return `with Coss and winding capacitance alone (${f1(d.resonantCF * 1e12)} pF) the resonant half-period limits duty to ${f3(d.resetDutyLimit)}, below the ${f3(Math.max(d.dutyAtVinMin, d.dutyLimit))} the controller may reach`;
    case 'no-output-capacitor': return `no output capacitor bank in the library reaches ${f1(d.outputCapacitanceF * 1e6)} µF at the ESR needed`;
    case 'no-output-inductor': return 'no output-inductor family in the library stores the energy needed';
    case 'no-clamp-part': return `no clamp or snubber part in the library takes the voltage or power (${f1(d.lossesW.resetOrClamp)} W) of the reset network`;
    case 'leakage-commutation': return `the leakage inductance (${f1(d.llkH * 1e6)} µH) takes so long to hand the load current to the forward rectifier that no turns ratio reaches the output within duty ${f3(d.dutyLimit)} at ${s.vinMinV} V: lower the leakage ratio or the switching frequency`;
    case 'unknown-part': return 'an override names a part id that is not in the library or not of the right kind';
  }
}

/**
 * Findings of one design: every failed limit as `fail`, near-limits as `warn`, scheme notes as
 * `info` (limits and thresholds: see assumptions.ts; common practice).
 */
export function findingsOf(d: Design, model: ResetSchemeModel): Finding[] {
  const s = d.spec;
  const out: Finding[] = [...new Set(d.fails)].map((code) => ({ severity: 'fail' as const, code, message: failMessage(code, d) }));
  if (s.targetEfficiency !== null && d.efficiency < s.targetEfficiency) {
    out.push({ severity: 'warn', code: 'efficiency-below-target', message: `efficiency ${pct(d.efficiency)} at ${s.vinNomV} V, full load is under the ${pct(s.targetEfficiency)} target` });
  }
  if (s.targetUnitCost !== null && d.bomCost > s.targetUnitCost) {
    out.push({ severity: 'warn', code: 'cost-above-target', message: `power-stage BOM ${d.bomCost.toFixed(2)} ${d.index.library.currency} at ${s.annualVolume} pcs/year is over the ${s.targetUnitCost} target` });
  }
  if (Number.isFinite(d.switchRatingV) && d.switchStressV > SMALL_MARGIN_SHARE * s.voltageDerating * d.switchRatingV) {
    out.push({ severity: 'warn', code: 'small-voltage-margin', message: `switch stress ${f1(d.switchStressV)} V uses ${pct(d.switchStressV / (s.voltageDerating * d.switchRatingV))} of the derated ${d.switchRatingV} V rating` });
  }
  if (d.bTransientT > 0.95 * d.bAvailableT && d.bTransientT <= d.bAvailableT) {
    out.push({ severity: 'warn', code: 'small-flux-margin', message: `transient flux swing ${f3(d.bTransientT)} T is within 5 % of the available ${f3(d.bAvailableT)} T` });
  }
  if (d.windowFill > 0.9 && d.windowFill <= 1) {
    out.push({ severity: 'warn', code: 'window-nearly-full', message: `windings fill ${pct(d.windowFill)} of the usable window` });
  }
  const tOnMinS = d.dutyAtVinMax / s.fswHz;
  if (tOnMinS < MIN_ON_TIME_S) {
    out.push({ severity: 'warn', code: 'short-on-time', message: `on-time at ${s.vinMaxV} V is ${f1(tOnMinS * 1e9)} ns, below the ${f1(MIN_ON_TIME_S * 1e9)} ns a controller regulates reliably (${f1(LEADING_EDGE_BLANKING_S * 1e9)} ns leading-edge blanking + ${f1(CONTROLLER_MIN_ON_TIME_S * 1e9)} ns minimum on-time): expect pulse skipping at high line; lower fs or narrow the input range` });
  }
  if (d.core && d.efficiency < EFFICIENCY_FLOOR) {
    out.push({ severity: 'warn', code: 'low-efficiency', message: `efficiency ${pct(d.efficiency)} at ${s.vinNomV} V, full load is below ${pct(EFFICIENCY_FLOOR)}: the losses (${f1(d.lossesW.total)} W) are over ${pct((1 - EFFICIENCY_FLOOR) / EFFICIENCY_FLOOR)} of the output, whatever the target` });
  }
  if (d.core && (s.fswHz < STEINMETZ_FIT_MIN_HZ || s.fswHz > STEINMETZ_FIT_MAX_HZ)) {
    out.push({ severity: 'warn', code: 'core-data-frequency', message: `${f1(s.fswHz / 1e3)} kHz is outside the ${f1(STEINMETZ_FIT_MIN_HZ / 1e3)}–${f1(STEINMETZ_FIT_MAX_HZ / 1e3)} kHz range the core material's loss fit is trusted over: the core loss (${f1(d.coreLossW)} W) is an extrapolation` });
  }
  if (d.rippleA / 2 > 0.1 * s.ioutA) {
    out.push({ severity: 'info', code: 'dcm-at-light-load', message: `the output inductor enters discontinuous conduction below ${pct(d.rippleA / 2 / s.ioutA)} load at ${s.vinMaxV} V` });
  }
  if (!model.leakageClamped) {
    out.push({ severity: 'info', code: 'unclamped-leakage', message: `nothing clamps the leakage: ${d.snubberNeeded ? 'a snubber holds' : 'the node capacitance holds'} the spike to ${f1(d.spikeV)} V and dissipates ½·Llk·Ip²·fs` });
  }
  if (model.transientDuty(d) >= d.dutyLimit - 1e-9 && d.transientV > d.switchPeakV * 1.001) {
    out.push({ severity: 'info', code: 'high-line-transient', message: `if duty reaches ${f3(d.dutyLimit)} at ${s.vinMaxV} V before the loop settles, the switch sees ${f1(d.transientV)} V; the rating covers it` });
  }
  if (d.core && d.fluxLimitedBy === 'transient' && model.transientDuty(d) >= d.dutyLimit - 1e-9) {
    out.push({ severity: 'info', code: 'turns-set-by-transient', message: `the primary turns (${d.turnsPrimary}) are set by the high-line transient, not by core loss or leakage: if duty reaches ${f3(d.dutyLimit)} at ${s.vinMaxV} V the flux must stay below saturation, so the steady swing is held to ${f3(d.deltaBT)} T; a volt-second (line feed-forward) duty clamp would allow fewer turns, and with them less leakage and copper` });
  }
  if (d.core && !d.index.winding) {
    out.push({ severity: 'info', code: 'windings-not-costed', message: `the parts library has no transformer-winding price: the ${d.windingCount} windings (${f1(d.copperMassKg * 1e3)} g of copper) are counted but not costed` });
  }
  for (const f of model.ownFindings(d)) out.push(f);
  return out;
}
