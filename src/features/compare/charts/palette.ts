/**
 * Colours for the stacked bar charts, where schemes are the x categories and the stack segments
 * are loss or cost categories. One hue (the app's teal accent) stepped evenly in lightness from a
 * deep accent to a pale neutral (OKLCH L 0.32 → 0.89), so neighbouring segments stay apart in
 * greyscale print and for every colour-vision type; a white hairline separates the segments.
 */
export const STACK_PALETTE_7 = ['#003f40', '#005858', '#397171', '#608b8a', '#87a5a5', '#aec1c0', '#d5dcdc'] as const;
export const STACK_PALETTE_6 = ['#003f40', '#0f5d5d', '#497b7b', '#789b9a', '#a6bbbb', '#d5dcdc'] as const;

/** Neutral for "other" and reference lines (the app's muted ink). */
export const NEUTRAL = '#5c6761';
/** The text colour of the app (--color-ink). */
export const INK = '#1e2622';

/**
 * `count` colours in lightness order (deep first), spread over the whole lightness range so
 * neighbours stay as far apart as possible. More than seven categories reuse steps (avoid that).
 */
export function stackColours(count: number): string[] {
  if (count <= 0) return [];
  if (count === 6) return [...STACK_PALETTE_6];
  if (count === 1) return [STACK_PALETTE_7[2]];
  const out: string[] = [];
  for (let i = 0; i < count; i++) out.push(STACK_PALETTE_7[Math.round((i * 6) / (count - 1))]!);
  return out;
}
