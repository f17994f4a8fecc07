/**
 * Design assumptions the engine applies to every scheme. Each carries its status:
 * [CP] common practice, [M] from memory, [V] seen in a source (tags as listed in src/engine/README.md).
 */

/** Duty margin below a reset-limited duty (e.g. 0.5 → 0.45) for leakage reset time and tolerances. [CP] */
export const DUTY_MARGIN = 0.05;
/** RCD clamp voltage set 20 % above the reset requirement Vin·D/(1−D) at the duty limit. [CP] */
export const RCD_CLAMP_MARGIN = 1.2;
/** Duty limit at which the RCD clamp is designed (before the controller limit). [CP] */
export const RCD_DESIGN_DUTY = 0.5;
/** Resonant reset: Cr chosen so the half resonant period ends at this duty. [CP] */
export const RESONANT_RESET_DUTY = 0.5;
/** Unclamped leakage spike held to this fraction of the off-state voltage by a snubber. [CP] */
export const SPIKE_FRACTION = 0.1;
/** Diode-recovery overshoot on a switch clamped to the rail (two-switch), fraction of Vin. [CP] */
export const RAIL_CLAMP_OVERSHOOT = 0.05;
/** Active clamp: clamp-capacitor ripple design ratio ΔVc/Vc (peak-to-peak). [CP] */
export const CLAMP_RIPPLE_RATIO = 0.1;
/**
 * Insulation between primary and secondary layers when the leakage is estimated from the build: three layers of
 * 50 µm polyester tape. [CP]
 */
export const INTERWINDING_INSULATION_M = 0.15e-3;
/**
 * Share of the primary–secondary leakage left between a bifilar (tightly coupled) primary and reset winding: the two
 * share every layer, so the field between them spans about one conductor instead of the whole build. At turn-off the
 * reset winding clamps the primary and returns the rest of the leakage energy to the input. [CP]
 */
export const BIFILAR_LEAKAGE_SHARE = 0.1;
/** Transformer winding + layout capacitance at the drain node. [CP] */
export const WINDING_CAPACITANCE_F = 50e-12;
/** Rds(on) at 100–125 °C ≈ 1.5–2 × the 25 °C value; 1.6 used. [CP] */
export const RDS_HOT_FACTOR = 1.6;
/** Gate-drive voltage. [CP] */
export const GATE_DRIVE_V = 10;
/** Share of Qg moved during the V–I overlap (Qgs2 + Qgd) and the driver current at the plateau as a share of peak. [CP] */
export const SWITCHING_CHARGE_SHARE = 0.35;
export const PLATEAU_CURRENT_SHARE = 0.5;
/** Average drain current limited to 0.6·ID (MIL-DTL-917 Table XIX, nominal working). [V] */
export const CURRENT_DERATING = 0.6;
/** Conduction-loss budget per switch position when choosing parts: 1 % of output power. [CP] */
export const CONDUCTION_BUDGET = 0.01;
/** Most parts paralleled in one position. [CP] */
export const MAX_PARALLEL = 4;
/** Rectifier average current at most 1/1.5 of its rating. [CP] */
export const RECTIFIER_CURRENT_MARGIN = 1.5;
/** Synchronous rectifier dead time per edge and body-diode drop. [CP] */
export const SR_DEAD_TIME_S = 40e-9;
export const BODY_DIODE_V = 0.8;
/** Winding and layout drop allowance, share of Vout, used in the turns-ratio equation. [CP] */
export const WINDING_DROP_SHARE = 0.01;
/** Window utilisation 0.4 (McLyman Ch. 7 [M]) × 0.75 packing of stranded conductor. [CP] */
export const KU_EFFECTIVE = 0.3;
/** Current density for the area-product estimate, 450 A/cm². [CP] */
export const CURRENT_DENSITY_A_PER_M2 = 4.5e6;
/** Core-loss density aimed at when choosing the flux swing, 150 kW/m³ (150 mW/cm³). [CP] */
export const CORE_LOSS_DENSITY_W_PER_M3 = 150e3;
/** Flux kept at or below 90 % of the available swing. [CP] */
export const FLUX_MARGIN = 0.9;
/** Copper and core temperature used for losses. [CP] */
export const HOT_C = 100;
/** Tolerance of the output capacitor (E6 pairing ±20 %, IEC 60063 tradition). [CP] */
export const CAP_TOLERANCE = 0.2;
/** Clamp/snubber resistor power used at ≤ 50 % of rating. [CP] */
export const RESISTOR_POWER_DERATING = 0.5;
/** Leading-edge blanking of the current sense, during which the controller cannot end the on time. [CP] */
export const LEADING_EDGE_BLANKING_S = 100e-9;
/** Controller propagation and minimum pulse after blanking. [CP] */
export const CONTROLLER_MIN_ON_TIME_S = 150e-9;
/** Shortest on time regulated reliably: blanking plus the controller's minimum (250 ns). [CP] */
export const MIN_ON_TIME_S = LEADING_EDGE_BLANKING_S + CONTROLLER_MIN_ON_TIME_S;
/** Efficiency below which a design is flagged whatever the target: it dissipates over 40 % of its output. [CP] */
export const EFFICIENCY_FLOOR = 0.7;
/**
 * Frequency range over which a three-parameter Steinmetz fit of a power ferrite is trusted: such fits hold over
 * roughly a decade around the frequency they were made at (the demo library's generic fit: 25–500 kHz). [CP]
 */
export const STEINMETZ_FIT_MIN_HZ = 25e3;
export const STEINMETZ_FIT_MAX_HZ = 500e3;
/** Voltage margin reported as small when stress uses more than this share of the derated rating. [CP] */
export const SMALL_MARGIN_SHARE = 0.95;
