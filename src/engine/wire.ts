/**
 * Copper conductor facts: IACS resistivity (IEC 60028), temperature coefficient, skin depth and
 * ASTM B258 AWG diameters.
 */

/** Annealed-copper resistivity at 20 °C, 1/58 Ω·mm²/m = 1.7241e-8 Ω·m (IEC 60028). */
export const COPPER_RESISTIVITY_20C_OHM_M = 1 / 58 * 1e-6;
/** Temperature coefficient of copper resistivity at 20 °C, 0.00393 /K (IEC 60028 / IACS). */
export const COPPER_ALPHA_PER_K = 0.00393;
/**
 * Density of annealed copper, 8890 kg/m³: the IEC 60028 mass resistivity 0.15328 Ω·g/m² over its resistivity
 * 1.7241e-8 Ω·m (IEC 60028, as tabled in shared FORMULAS §3.4).
 */
export const COPPER_DENSITY_KG_PER_M3 = 0.15328e-3 / COPPER_RESISTIVITY_20C_OHM_M;
/** Vacuum permeability µ0 (SI, 4π·10⁻⁷ H/m to the precision needed here). */
export const MU0 = 4e-7 * Math.PI;

/**
 * Copper resistivity at a temperature: ρ(T) = ρ20·[1 + 0.00393·(T − 20)] (IEC 60028 / IACS).
 * Example: copperResistivity(100) ≈ 2.2662e-8 Ω·m.
 */
export function copperResistivity(temperatureC: number): number {
  if (!Number.isFinite(temperatureC) || temperatureC < -200 || temperatureC > 400) {
    throw new RangeError(`copper temperature must be between -200 and 400 °C, got ${temperatureC}`);
  }
  return COPPER_RESISTIVITY_20C_OHM_M * (1 + COPPER_ALPHA_PER_K * (temperatureC - 20));
}

/**
 * Skin depth δ = √(ρ/(π·f·µ0·µr)) (standard physics; e.g. Johnson, Transmission Lines and Networks, 1963).
 * Copper at 20 °C: δ ≈ 66.1 mm/√f. Returns metres.
 */
export function skinDepthM(frequencyHz: number, temperatureC = 100, muR = 1): number {
  if (!(frequencyHz > 0) || !Number.isFinite(frequencyHz)) {
    throw new RangeError(`skin depth needs a positive frequency, got ${frequencyHz} Hz`);
  }
  return Math.sqrt(copperResistivity(temperatureC) / (Math.PI * frequencyHz * MU0 * muR));
}

/**
 * AWG wire diameter by the ASTM B258 defining formula d = 0.127 mm × 92^((36 − n)/39).
 * Gauge n from −3 (0000) to 56. Returns metres. Example: awgDiameterM(36) = 1.27e-4.
 */
export function awgDiameterM(gauge: number): number {
  if (!Number.isInteger(gauge) || gauge < -3 || gauge > 56) {
    throw new RangeError(`AWG gauge must be an integer from -3 (0000) to 56, got ${gauge}`);
  }
  return 0.127e-3 * Math.pow(92, (36 - gauge) / 39);
}

/**
 * Thickest AWG strand whose diameter does not exceed `maxDiameterM` (e.g. 2·δ so that skin
 * effect stays small, common practice). Closed form of the B258 formula, rounded up to an integer gauge.
 */
export function awgForMaxDiameter(maxDiameterM: number): number {
  if (!(maxDiameterM > 0)) throw new RangeError(`strand diameter limit must be positive, got ${maxDiameterM} m`);
  const n = Math.ceil(36 - 39 * Math.log(maxDiameterM / 0.127e-3) / Math.log(92) - 1e-9);
  return Math.min(56, Math.max(-3, n));
}
