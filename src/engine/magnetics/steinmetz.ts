/**
 * Steinmetz core-loss density Pv = k·f^α·B̂^β (Steinmetz 1892; three-parameter form as used in
 * the iGSE/MSE literature [M]). k in W/m³ for f in Hz and B̂ (peak of the ac flux) in T.
 * Example: k = 3.98, α = 1.4, β = 2.6, f = 100 kHz, B̂ = 0.1 T → ≈ 1.0e5 W/m³.
 */
export function coreLossDensityWPerM3(k: number, alpha: number, beta: number, fHz: number, bPeakT: number): number {
  if (!(k > 0) || !(alpha > 0) || !(beta > 0)) throw new RangeError(`Steinmetz k, α, β must be positive (got ${k}, ${alpha}, ${beta})`);
  if (!(fHz > 0)) throw new RangeError(`core-loss frequency must be positive, got ${fHz} Hz`);
  if (!(bPeakT >= 0)) throw new RangeError(`peak flux density must not be negative, got ${bPeakT} T`);
  return k * Math.pow(fHz, alpha) * Math.pow(bPeakT, beta);
}

/**
 * Peak flux density at which the Steinmetz loss density equals `pvWPerM3`:
 * B̂ = (Pv/(k·f^α))^(1/β) — the inverse of coreLossDensityWPerM3 (derived).
 */
export function peakFluxForLossDensityT(k: number, alpha: number, beta: number, fHz: number, pvWPerM3: number): number {
  if (!(pvWPerM3 > 0)) throw new RangeError(`target loss density must be positive, got ${pvWPerM3} W/m³`);
  return Math.pow(pvWPerM3 / (k * Math.pow(fHz, alpha)), 1 / beta);
}
