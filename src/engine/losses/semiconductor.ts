/** Loss terms of power semiconductors (sources per function). All return watts. */

/** Conduction loss P = Irms²·R (common practice). */
export function conductionLossW(irmsA: number, rOhm: number): number {
  return irmsA * irmsA * rOhm;
}

/**
 * Hard-switching V–I overlap loss of one edge, P = ½·V·I·tc·fs (linearised clamped-inductive
 * switching; Mohan, Undeland & Robbins, 3rd ed., ch. 2 [M]).
 */
export function overlapLossW(vV: number, iA: number, tcS: number, fswHz: number): number {
  return vV > 0 && iA > 0 ? 0.5 * vV * iA * tcS * fswHz : 0;
}

/**
 * Output-capacitance loss at hard turn-on, P = ½·Co(er)·V²·fs (energy-related capacitance;
 * Erickson & Maksimović §4.3 [M]).
 */
export function capacitiveLossW(cF: number, vV: number, fswHz: number): number {
  return vV > 0 ? 0.5 * cF * vV * vV * fswHz : 0;
}

/** Gate-drive loss P = Qg·Vgs·fs (dissipated in the driver and gate resistors; common practice). */
export function gateDriveLossW(qgC: number, vgsV: number, fswHz: number): number {
  return qgC * vgsV * fswHz;
}

/** Reverse-recovery loss P ≈ Qrr·VR·fs (common practice). */
export function reverseRecoveryLossW(qrrC: number, vrV: number, fswHz: number): number {
  return qrrC * vrV * fswHz;
}

/**
 * Switching (overlap) time of a MOSFET edge from its charge and the driver:
 * tc = share·Qg/(plateau share·Ipeak) (common-practice estimate).
 */
export function transitionTimeS(qgC: number, driverPeakA: number, chargeShare: number, plateauShare: number): number {
  if (!(driverPeakA > 0)) throw new RangeError(`gate-driver peak current must be positive, got ${driverPeakA} A`);
  return (chargeShare * qgC) / (plateauShare * driverPeakA);
}
