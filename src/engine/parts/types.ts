/**
 * Parts-library shape shared by the engine, the database import and CSV mapping.
 * Plain JSON-serialisable records; all values in SI units (V, A, Ω, C, F, m, m², m³, H, J).
 */

/** Unit price that applies from `minQty` pieces per year upwards. */
export type PriceTier = {
  minQty: number;
  unitPrice: number;
};

/** Approval status of a part: `nfnd` = not for new designs (never picked automatically). */
export type PartStatus = 'preferred' | 'allowed' | 'nfnd';

export type PartBase = {
  id: string;
  description?: string;
  status: PartStatus;
  tiers: PriceTier[];
};

/** Power MOSFET (primary switch, clamp switch or synchronous rectifier). */
export type MosfetPart = PartBase & {
  channel: 'n' | 'p';
  vdsV: number;
  /** Continuous drain current rating at 25 °C case. */
  idA: number;
  /** On-resistance at 25 °C junction. */
  rdsOnOhm: number;
  /** Total gate charge at the drive voltage. */
  qgC: number;
  /** Energy-related output capacitance Co(er). */
  cossF: number;
};

/** Schottky or ultrafast rectifier (also used for clamp and reset diodes). */
export type RectifierPart = PartBase & {
  kind: 'schottky' | 'ultrafast';
  vrrmV: number;
  ifA: number;
  vfV: number;
  /** Reverse-recovery charge (≈ 0 for Schottky; junction charge neglected). */
  qrrC: number;
};

/** Gate driver; `peakA` is the source/sink peak current. */
export type GateDriverPart = PartBase & {
  kind: 'low-side' | 'bootstrap-high-side' | 'isolated';
  peakA: number;
};

/** IEC ferrite core shape families used in the library. */
export type CoreShapeFamily = 'E' | 'EFD' | 'ETD' | 'PQ' | 'RM' | 'EQ';

/** Ferrite core set (pair) with effective parameters and a generic power-ferrite Steinmetz fit. */
export type CorePart = PartBase & {
  shapeFamily: CoreShapeFamily;
  size: string;
  aeM2: number;
  leM: number;
  veM3: number;
  /** Winding (bobbin) window area. */
  waM2: number;
  /** Mean length of a turn. */
  mltM: number;
  /** Inductance factor of the ungapped set, H per turn². */
  alH: number;
  /** Steinmetz fit Pv = k·f^α·B̂^β in W/m³ with f in Hz and B̂ in T. */
  steinmetzK: number;
  steinmetzAlpha: number;
  steinmetzBeta: number;
  /** Saturation flux density at 100 °C. */
  bsatT: number;
  /** Remanent flux density at 100 °C. */
  brT: number;
};

/** Capacitor (output filter, clamp or resonant capacitor). */
export type CapacitorPart = PartBase & {
  dielectric: 'ceramic' | 'polymer' | 'film' | 'electrolytic';
  capacitanceF: number;
  voltageV: number;
  esrOhm: number;
};

/** Resistor family: the value is chosen from an E-series; the part fixes the power rating. */
export type ResistorPart = PartBase & {
  powerW: number;
  voltageV: number;
};

/**
 * Output-inductor core family wound to the value needed: stores at most `energyJ` (½·L·I²)
 * and its winding resistance scales with inductance, `dcrOhmPerH` (R = dcrOhmPerH·L).
 */
export type InductorPart = PartBase & {
  energyJ: number;
  dcrOhmPerH: number;
};

/**
 * Winding of a transformer by the team's winding shop: `tiers` price the labour of one winding (layers, insulation,
 * terminations) at volume; the copper is priced by its mass at `copperPricePerKg` (library currency per kilogram).
 */
export type WindingPart = PartBase & {
  copperPricePerKg: number;
};

/** A whole parts library. */
export type PartsLibrary = {
  name: string;
  version: string;
  /** ISO 4217 code of every unit price. */
  currency: string;
  /** True for invented demonstration data. */
  demo?: boolean;
  note?: string;
  mosfets: MosfetPart[];
  srMosfets: MosfetPart[];
  rectifiers: RectifierPart[];
  clampDiodes: RectifierPart[];
  gateDrivers: GateDriverPart[];
  cores: CorePart[];
  capacitors: CapacitorPart[];
  resistors: ResistorPart[];
  inductors: InductorPart[];
  /** Winding labour and copper; libraries from before windings were costed have none (the engine then says so). */
  windings: WindingPart[];
};

/** Library category names. */
export type PartCategory = Exclude<keyof PartsLibrary, 'name' | 'version' | 'currency' | 'demo' | 'note'>;

/** Any part of any category. */
export type AnyPart = PartsLibrary[PartCategory][number];

/** A library as stored: the version number lives in its own database column. */
export type StoredLibrary = Omit<PartsLibrary, 'version'>;

/** The parts of one category, each readable field by field (for tables, CSV and change lists). */
export function partsOf(library: PartsLibrary, category: PartCategory): readonly (AnyPart & Readonly<Record<string, unknown>>)[] {
  return library[category];
}
