/** Reset-scheme ids (a contract: never rename) in display order. */
export const SCHEME_IDS = ['tertiary-winding', 'rcd-clamp', 'active-clamp', 'two-switch', 'resonant-reset'] as const;

/** One reset-scheme id. */
export type SchemeId = (typeof SCHEME_IDS)[number];

/** Plain names for the UI. */
export const SCHEME_LABELS: Readonly<Record<SchemeId, string>> = {
  'tertiary-winding': 'Tertiary winding',
  'rcd-clamp': 'RCD clamp',
  'active-clamp': 'Active clamp',
  'two-switch': 'Two-switch',
  'resonant-reset': 'Resonant reset',
};
