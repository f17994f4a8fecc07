import type { SchemeId } from '../engine/scheme-ids';

/**
 * Resetwise's scheme palette, used the same way on cards, schematics and charts. Hues are
 * spread so they stay apart for the common colour-vision deficiencies, and every scheme also
 * has its own line dash and point marker so charts read in greyscale print too.
 */
export interface SchemeStyle {
  color: string;
  /** A light tint of `color` for backgrounds. */
  tint: string;
  /** Canvas line dash pattern (px). */
  dash: number[];
  /** Chart.js point style. */
  marker: 'circle' | 'triangle' | 'rect' | 'rectRot' | 'star';
}

export const SCHEME_STYLES: Record<SchemeId, SchemeStyle> = {
  'tertiary-winding': { color: '#2364aa', tint: '#e4edf7', dash: [], marker: 'circle' },
  'rcd-clamp': { color: '#c75a12', tint: '#fbeadf', dash: [7, 4], marker: 'triangle' },
  'active-clamp': { color: '#1f8a5b', tint: '#e2f3ea', dash: [2, 3], marker: 'rect' },
  'two-switch': { color: '#8a3b9e', tint: '#f1e6f4', dash: [10, 3, 2, 3], marker: 'rectRot' },
  'resonant-reset': { color: '#a07a00', tint: '#f6efd9', dash: [14, 5], marker: 'star' },
};
