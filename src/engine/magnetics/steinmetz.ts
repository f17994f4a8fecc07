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

/** Γ(x) for x > 0 by the Lanczos approximation (g = 7, nine coefficients; Numerical Recipes 3rd ed. §6.1). */
function gamma(x: number): number {
  const c = [0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059,
    12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7];
  if (x < 0.5) return Math.PI / (Math.sin(Math.PI * x) * gamma(1 - x));
  const z = x - 1;
  let a = c[0]!;
  const t = z + 7.5;
  for (let i = 1; i < 9; i++) a += c[i]! / (z + i);
  return Math.sqrt(2 * Math.PI) * Math.pow(t, z + 0.5) * Math.exp(-t) * a;
}

/** ∫0..2π |cos θ|^α dθ = 2·√π·Γ((α + 1)/2)/Γ(α/2 + 1) (Beta-function identity). */
function cosineIntegral(alpha: number): number {
  return (2 * Math.sqrt(Math.PI) * gamma((alpha + 1) / 2)) / gamma(alpha / 2 + 1);
}

// One-entry memo of the α-only denominator (a library's cores share one α; a sweep evaluates thousands of designs).
const denominator = { alpha: NaN, value: NaN };
function igseDenominator(alpha: number): number {
  if (denominator.alpha !== alpha) {
    denominator.value = Math.pow(2, alpha) / (Math.pow(2 * Math.PI, alpha - 1) * cosineIntegral(alpha));
    denominator.alpha = alpha;
  }
  return denominator.value;
}

/**
 * Ratio of the improved generalized Steinmetz equation's loss for a flux that rises by ΔB in `riseShare`·T and falls
 * back in `fallShare`·T (linear segments, any dwell at constant flux adds nothing) to the sine-wave Steinmetz loss
 * k·f^α·(ΔB/2)^β of the same peak-to-peak swing:
 *   W = 2^α·(d1^(1−α) + d2^(1−α)) / ((2π)^(α−1)·∫0..2π |cos θ|^α dθ).
 * From iGSE, Pv = (1/T)·∫ ki·|dB/dt|^α·ΔB^(β−α) dt with ki = k/((2π)^(α−1)·∫|cos θ|^α dθ·2^(β−α)) (Venkatachalam,
 * Sullivan, Abdallah & Tacca, "Accurate prediction of ferrite core loss with nonsinusoidal waveforms using only
 * Steinmetz parameters", IEEE COMPEL 2002); for linear segments Pv = ki·f^α·ΔB^β·(d1^(1−α) + d2^(1−α)), and β cancels
 * in the ratio (derived). W = 1 for a sine by construction; a symmetric triangle gives ≈ 0.93 at α = 1.4. Dc bias is
 * not modelled (it raises the loss further; see src/engine/README.md).
 */
export function igseWaveformFactor(alpha: number, riseShare: number, fallShare: number): number {
  if (!(alpha > 0)) throw new RangeError(`Steinmetz α must be positive, got ${alpha}`);
  if (!(riseShare > 0 && riseShare <= 1) || !(fallShare > 0 && fallShare <= 1)) {
    throw new RangeError(`flux rise and fall shares must lie in (0, 1], got ${riseShare}, ${fallShare}`);
  }
  const segments = Math.pow(riseShare, 1 - alpha) + Math.pow(fallShare, 1 - alpha);
  return segments * igseDenominator(alpha);
}
