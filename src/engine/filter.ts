/** Output LC filter of the forward converter (buck-derived; Mohan, Undeland & Robbins ch. 7 [M]). */

/**
 * Inductance for a peak-to-peak ripple at the smallest duty: L = (Vo + VF)·(1 − Dmin)/(ΔIL·fs)
 * (buck ripple, Mohan, Undeland & Robbins ch. 7 [M]; derived by volt-seconds on L).
 */
export function inductanceForRippleH(voPlusDropV: number, dutyMin: number, rippleA: number, fswHz: number): number {
  if (!(rippleA > 0)) throw new RangeError(`inductor ripple current must be positive, got ${rippleA} A`);
  if (!(dutyMin >= 0 && dutyMin < 1)) throw new RangeError(`duty must be in [0, 1), got ${dutyMin}`);
  return (voPlusDropV * (1 - dutyMin)) / (rippleA * fswHz);
}

/** Peak-to-peak inductor ripple ΔIL = (Vo + VF)·(1 − D)/(L·fs) (same source). */
export function inductorRippleA(voPlusDropV: number, duty: number, lH: number, fswHz: number): number {
  return (voPlusDropV * (1 - duty)) / (lH * fswHz);
}

/**
 * Capacitance for a peak-to-peak ripple (capacitive part only): C = ΔIL/(8·fs·ΔVo)
 * (Mohan, Undeland & Robbins ch. 7 [M]; Hart ch. 6 [M]).
 */
export function capacitanceForRippleF(rippleA: number, fswHz: number, rippleV: number): number {
  if (!(rippleV > 0)) throw new RangeError(`output ripple voltage must be positive, got ${rippleV} V`);
  return rippleA / (8 * fswHz * rippleV);
}
