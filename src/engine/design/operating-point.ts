import {
  BODY_DIODE_V, GATE_DRIVE_V, PLATEAU_CURRENT_SHARE, RDS_HOT_FACTOR, SR_DEAD_TIME_S, SWITCHING_CHARGE_SHARE,
} from '../assumptions';
import { rippleAtA } from './duty';
import { magnetizingStartAt, switchRmsA } from './stress';
import {
  capacitiveLossW, conductionLossW, gateDriveLossW, overlapLossW, reverseRecoveryLossW, transitionTimeS,
} from '../losses/semiconductor';
import type { ResetSchemeModel } from '../schemes/types';
import { copperLossW } from './magnetics';
import type { Design, LossesW } from './types';

/** A zeroed loss breakdown. */
export function zeroLosses(): LossesW {
  return { switchConduction: 0, switching: 0, gateDrive: 0, resetOrClamp: 0, rectifiers: 0, transformer: 0, inductor: 0, total: 0 };
}

/**
 * Loss breakdown at an input voltage and load fraction, written into `out` (a new record when
 * omitted). Conduction uses the effective duty K/Vin and the ripple the leakage leaves (design/duty.ts); the inductor is assumed to stay in continuous conduction.
 * Terms: conduction Irms²·R, linear V–I overlap and ½·Co(er)·V² switching (Mohan, Undeland &
 * Robbins, 3rd ed., ch. 2 [M]; Erickson & Maksimović §4.3 [M]), gate charge Qg·Vgs·fs, rectifier
 * VF·Io or Irms²·R plus recovery, core (Steinmetz) and copper loss, inductor DCR (common practice).
 */
export function lossesAt(d: Design, model: ResetSchemeModel, vinV: number, loadFraction: number, out: LossesW = zeroLosses()): LossesW {
  const s = d.spec;
  const fs = s.fswHz;
  const io = s.ioutA * loadFraction;
  const duty = d.kV / vinV;
  const ripple = rippleAtA(d, vinV);
  const iL2 = io * io + (ripple * ripple) / 12;
  const n = d.turnsRatio;
  const im0 = magnetizingStartAt(d, model, vinV);
  const ipPk = n * (io + ripple / 2) + im0 + d.magnetizingSwingA;
  const irms = switchRmsA(duty, n * (io - ripple / 2) + im0, ipPk);
  out.switchConduction = 0;
  out.switching = 0;
  out.gateDrive = 0;
  out.rectifiers = 0;
  const sw = d.mainSwitch;
  const positions = model.seriesSwitches;
  if (sw) {
    const qty = d.mainQty;
    out.switchConduction = positions * conductionLossW(irms, (sw.rdsOnOhm * RDS_HOT_FACTOR) / qty);
    const drvPeak = (d.highSideDrivers > 0 ? d.index.drivers['bootstrap-high-side'] : d.index.drivers['low-side'])?.peakA ?? 2;
    const tc = transitionTimeS(sw.qgC * qty, drvPeak, SWITCHING_CHARGE_SHARE, PLATEAU_CURRENT_SHARE);
    // Each switch blocks its own off-state voltage at turn-off: in the two-switch forward both drains rise together until
    // the clamp diodes conduct, so each sees the full Vin (Hart §7.5 [M]; ngspice: 75.03 V on both at 75 V in).
    const vOff = model.offStateV(d, vinV);
    const vOn = model.turnOnV(d, vinV);
    const ionA = Math.max(0, n * (io - ripple / 2));
    out.switching = positions * (overlapLossW(vOff, ipPk, tc, fs) + overlapLossW(vOn, ionA, tc, fs)
      + capacitiveLossW(sw.cossF * qty, vOn, fs));
    out.gateDrive = positions * gateDriveLossW(sw.qgC * qty, GATE_DRIVE_V, fs);
  }
  if (d.auxSwitch) out.gateDrive += gateDriveLossW(d.auxSwitch.qgC, GATE_DRIVE_V, fs);
  if (d.rectSr) {
    const r = (d.rectSr.rdsOnOhm * RDS_HOT_FACTOR) / d.rectQty;
    // Forward SR conducts for D, freewheel SR for 1 − D: together (Io² + ΔIL²/12)·R, plus body-diode dead time.
    out.rectifiers = iL2 * r + BODY_DIODE_V * io * 2 * SR_DEAD_TIME_S * fs;
    out.gateDrive += 2 * gateDriveLossW(d.rectSr.qgC * d.rectQty, GATE_DRIVE_V, fs);
  } else if (d.rectDiode) {
    // D1 carries D·Io, D2 (1 − D)·Io: together VF·Io; recovery at the reverse voltages.
    out.rectifiers = d.rectDiode.vfV * io + reverseRecoveryLossW(d.rectDiode.qrrC * d.rectQty, d.rectForwardV + n * vinV, fs);
  }
  out.resetOrClamp = model.resetLossW(d, vinV, duty, ipPk, irms);
  out.transformer = d.coreLossW + copperLossW(d, duty, io, ripple);
  out.inductor = d.inductor ? iL2 * d.inductor.dcrOhmPerH * d.outputInductanceH : 0;
  out.total = out.switchConduction + out.switching + out.gateDrive + out.resetOrClamp + out.rectifiers + out.transformer + out.inductor;
  return out;
}

/** Efficiency from output power and losses, η = Pout/(Pout + ΣP) (definition). */
export function efficiencyOf(poutW: number, lossW: number): number {
  return poutW / (poutW + lossW);
}
