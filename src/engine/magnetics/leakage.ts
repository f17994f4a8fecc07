import { MU0 } from '../wire';
import type { CoreShapeFamily } from '../parts/types';

/**
 * Leakage inductance of a transformer from its build: the energy stored in the field between and inside the windings.
 * Across a window of breadth b (along the core leg) the ampere-turns N·I of the primary build up linearly through its
 * layers (thickness a1), stay at N·I across the insulation between primary and secondary (thickness c), and fall back
 * to zero through the secondary (a2). The field is H = N·I/b there, so the stored energy is
 *   ½·Llk·I² = ½·µ0·(N·I/b)²·MLT·b·(c + (a1 + a2)/3)
 * and Llk = µ0·N²·MLT·(c + (a1 + a2)/3)/b — the standard formula of McLyman, Transformer and Inductor Design Handbook,
 * 3rd ed., ch. 17 (leakage inductance) [M], the one-dimensional field of Dowell (Proc. IEE 113(8), 1966) [M].
 *
 * Interleaved (primary split in two halves around the secondary, P–S–P): each half of the window holds half the
 * ampere-turns across one interface, with half of each build, so the energy is 2·¼ of that of a window with
 * c + (a1 + a2)/6, i.e. Llk = µ0·N²·MLT·(2c + (a1 + a2)/3)/(4·b) (derived from the same energy integral).
 */

/** Winding arrangements the leakage estimate knows. */
export type WindingArrangement = 'non-interleaved' | 'interleaved';

/**
 * Effective thickness of the leakage field, c + (a1 + a2)/3 (non-interleaved) or (2c + (a1 + a2)/3)/4 (interleaved), in
 * metres, for a build of `windingsBuildM` (a1 + a2) and insulation `insulationM` between primary and secondary.
 */
export function leakageThicknessM(arrangement: WindingArrangement, windingsBuildM: number, insulationM: number): number {
  if (!(windingsBuildM >= 0) || !(insulationM >= 0)) {
    throw new RangeError(`winding build and insulation must not be negative, got ${windingsBuildM} m, ${insulationM} m`);
  }
  return arrangement === 'interleaved'
    ? (2 * insulationM + windingsBuildM / 3) / 4
    : insulationM + windingsBuildM / 3;
}

/**
 * Leakage inductance referred to a winding of `turns`: Llk = µ0·N²·MLT·t/b (McLyman ch. 17 [M]; see above), with t the
 * effective thickness from `leakageThicknessM`. Example: 40 turns, MLT 61 mm, t 1.6 mm, b 20 mm → 9.8 µH.
 */
export function leakageInductanceH(turns: number, mltM: number, thicknessM: number, breadthM: number): number {
  if (!(turns > 0) || !(mltM > 0) || !(breadthM > 0) || !(thicknessM >= 0)) {
    throw new RangeError(`leakage needs positive turns, mean turn length and window breadth, got ${turns}, ${mltM} m, ${breadthM} m`);
  }
  return (MU0 * turns * turns * mltM * thicknessM) / breadthM;
}

/**
 * Breadth-to-height ratio b/h of the usable winding window (bobbin) of each core family: the window's length along the
 * leg over its depth from the leg outwards. Typical of the families' standard sizes, read off common outlines (from
 * memory): E and ETD windows are tall and narrow, EFD low-profile ones more so, PQ, RM and EQ windows squarer.
 */
export const WINDOW_ASPECT: Readonly<Record<CoreShapeFamily, number>> = {
  E: 3.5, ETD: 3.3, EFD: 5, PQ: 1.6, RM: 2.2, EQ: 1.5,
};

/** Breadth b and height h of a window of area `waM2` and the family's aspect ratio (b·h = Wa, b/h = r). */
export function windowShapeM(waM2: number, family: CoreShapeFamily): { breadthM: number; heightM: number } {
  if (!(waM2 > 0)) throw new RangeError(`window area must be positive, got ${waM2} m²`);
  const r = WINDOW_ASPECT[family];
  return { breadthM: Math.sqrt(waM2 * r), heightM: Math.sqrt(waM2 / r) };
}
