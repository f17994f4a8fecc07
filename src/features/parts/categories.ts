import type { PartCategory } from '../../engine/parts/types';

/**
 * What the Parts library screen, the CSV format and the validation know about each category:
 * the electrical fields the engine reads (SI units, the unit in the name), in table order.
 * Safe on both sides (no server imports).
 */

export type FieldKind = 'number' | 'choice' | 'text';

export interface PartField {
  key: string;
  label: string;
  kind: FieldKind;
  /** SI unit for `formatSi` (numbers only); '' for a plain number. */
  unit?: string;
  options?: readonly string[];
  /** Must be greater than zero (otherwise at least zero). */
  positive?: boolean;
  /** Optional in the library (`description` only). */
  optional?: boolean;
  hint?: string;
}

export interface CategoryInfo {
  key: PartCategory;
  label: string;
  /** One part of this category, singular, for messages. */
  singular: string;
  fields: readonly PartField[];
}

const n = (key: string, label: string, unit: string, extra: Partial<PartField> = {}): PartField => ({ key, label, kind: 'number', unit, positive: true, ...extra });
const c = (key: string, label: string, options: readonly string[]): PartField => ({ key, label, kind: 'choice', options });

export const MOSFET_CHANNELS = ['n', 'p'] as const;
export const RECTIFIER_KINDS = ['schottky', 'ultrafast'] as const;
export const DRIVER_KINDS = ['low-side', 'bootstrap-high-side', 'isolated'] as const;
export const CORE_FAMILIES = ['E', 'EFD', 'ETD', 'PQ', 'RM', 'EQ'] as const;
export const DIELECTRICS = ['ceramic', 'polymer', 'film', 'electrolytic'] as const;
export const PART_STATUSES = ['preferred', 'allowed', 'nfnd'] as const;

export const STATUS_LABELS: Record<(typeof PART_STATUSES)[number], string> = {
  preferred: 'Preferred',
  allowed: 'Allowed',
  nfnd: 'Not for new designs',
};

const mosfetFields = [
  c('channel', 'Channel', MOSFET_CHANNELS),
  n('vdsV', 'VDS rating', 'V'),
  n('idA', 'ID at 25 °C', 'A'),
  n('rdsOnOhm', 'RDS(on) at 25 °C', 'Ω'),
  n('qgC', 'Gate charge Qg', 'C'),
  n('cossF', 'Coss(er)', 'F'),
] as const;

const rectifierFields = [
  c('kind', 'Kind', RECTIFIER_KINDS),
  n('vrrmV', 'VRRM', 'V'),
  n('ifA', 'IF(AV)', 'A'),
  n('vfV', 'Forward drop VF', 'V'),
  n('qrrC', 'Recovery charge Qrr', 'C', { positive: false }),
] as const;

/** Every category in the order the screen shows them. */
export const CATEGORIES: readonly CategoryInfo[] = [
  { key: 'mosfets', label: 'MOSFETs (primary and clamp switches)', singular: 'MOSFET', fields: mosfetFields },
  { key: 'srMosfets', label: 'Synchronous-rectifier MOSFETs', singular: 'SR MOSFET', fields: mosfetFields },
  { key: 'rectifiers', label: 'Output rectifiers', singular: 'rectifier', fields: rectifierFields },
  { key: 'clampDiodes', label: 'Clamp and reset diodes', singular: 'clamp diode', fields: rectifierFields },
  { key: 'gateDrivers', label: 'Gate drivers', singular: 'gate driver', fields: [c('kind', 'Kind', DRIVER_KINDS), n('peakA', 'Peak drive current', 'A')] },
  {
    key: 'cores', label: 'Transformer cores', singular: 'core',
    fields: [
      c('shapeFamily', 'Shape family', CORE_FAMILIES),
      { key: 'size', label: 'Size', kind: 'text', hint: 'e.g. 25/13/7' },
      n('aeM2', 'Ae', 'm²'), n('leM', 'le', 'm'), n('veM3', 'Ve', 'm³'), n('waM2', 'Winding window Wa', 'm²'),
      n('mltM', 'Mean turn length', 'm'), n('alH', 'AL (ungapped)', 'H'),
      n('steinmetzK', 'Steinmetz k', '', { hint: 'Pv = k·f^α·B̂^β in W/m³, f in Hz, B̂ in T' }),
      n('steinmetzAlpha', 'Steinmetz α', ''), n('steinmetzBeta', 'Steinmetz β', ''),
      n('bsatT', 'Bsat at 100 °C', 'T'), n('brT', 'Br at 100 °C', 'T', { positive: false }),
    ],
  },
  {
    key: 'capacitors', label: 'Capacitors', singular: 'capacitor',
    fields: [c('dielectric', 'Dielectric', DIELECTRICS), n('capacitanceF', 'Capacitance', 'F'), n('voltageV', 'Voltage rating', 'V'), n('esrOhm', 'ESR', 'Ω')],
  },
  {
    key: 'resistors', label: 'Clamp parts: resistors', singular: 'resistor',
    fields: [n('powerW', 'Power rating', 'W'), n('voltageV', 'Voltage rating', 'V')],
  },
  {
    key: 'inductors', label: 'Output-inductor cores', singular: 'inductor core',
    fields: [n('energyJ', 'Stored energy ½LI²', 'J'), n('dcrOhmPerH', 'DCR per henry', 'Ω/H')],
  },
  {
    key: 'windings', label: 'Transformer windings (labour and copper)', singular: 'winding price',
    fields: [n('copperPricePerKg', 'Copper wire per kg (library currency)', '', { hint: 'price of a kilogram of winding wire; the tiers price the labour of one winding' })],
  },
];

export const CATEGORY_KEYS = CATEGORIES.map((cat) => cat.key);

export function categoryInfo(key: string): CategoryInfo | undefined {
  return CATEGORIES.find((cat) => cat.key === key);
}

/** Most price tiers a part may carry (and the CSV has columns for). */
export const MAX_TIERS = 6;
