/**
 * Area product of a single-ended forward transformer, Ap = Wa·Ae = D·Pt/(Ku·ΔB·J·f) in m⁴
 * (derived from Ku·Wa = ΣNi·Ii/J with Ni = Vi·D/(f·ΔB·Ae); equals McLyman's Ch. 7 form with
 * Kf = 4 at D = 0.5 [M]).
 */
export function areaProductM4(duty: number, apparentPowerW: number, ku: number, deltaBT: number, jAPerM2: number, fHz: number): number {
  if (!(duty > 0 && duty < 1)) throw new RangeError(`area product needs 0 < duty < 1, got ${duty}`);
  if (!(apparentPowerW > 0) || !(ku > 0) || !(deltaBT > 0) || !(jAPerM2 > 0) || !(fHz > 0)) {
    throw new RangeError('area product needs positive apparent power, Ku, ΔB, J and f');
  }
  return (duty * apparentPowerW) / (ku * deltaBT * jAPerM2 * fHz);
}

/**
 * Apparent power of a single-ended forward transformer, Pt ≈ (Po′/√D)·(1 + 1/η),
 * Po′ = (Vo + VF)·Io; reset-winding VA neglected (derived).
 */
export function forwardApparentPowerW(poPrimeW: number, duty: number, efficiency: number): number {
  if (!(duty > 0 && duty < 1)) throw new RangeError(`apparent power needs 0 < duty < 1, got ${duty}`);
  if (!(efficiency > 0 && efficiency <= 1)) throw new RangeError(`efficiency must be in (0, 1], got ${efficiency}`);
  return (poPrimeW / Math.sqrt(duty)) * (1 + 1 / efficiency);
}

/**
 * Winding copper loss with the window shared in proportion to ampere-turns (the optimum
 * allocation, Erickson & Maksimović ch. 15 [M]): P = ρ·MLT·(ΣNj·Ij,rms)²/(Ku·Wa).
 */
export function windingLossW(rhoOhmM: number, mltM: number, ampereTurnsA: number, kuWaM2: number): number {
  if (!(kuWaM2 > 0)) throw new RangeError(`copper window area must be positive, got ${kuWaM2} m²`);
  return (rhoOhmM * mltM * ampereTurnsA * ampereTurnsA) / kuWaM2;
}
