import type {
  CapacitorPart, CorePart, GateDriverPart, InductorPart, MosfetPart, PartsLibrary, PriceTier,
  RectifierPart, ResistorPart, WindingPart,
} from './types';

/**
 * A parts library pre-indexed once for fast selection: each category sorted by its key rating,
 * parts marked `nfnd` left out of automatic choice, ids in one map for overrides.
 */
export interface LibraryIndex {
  library: PartsLibrary;
  nMosfets: MosfetPart[];
  pMosfets: MosfetPart[];
  srMosfets: MosfetPart[];
  rectifiers: RectifierPart[];
  clampDiodes: RectifierPart[];
  coresByAp: CorePart[];
  coreApM4: Float64Array;
  capacitors: CapacitorPart[];
  resistors: ResistorPart[];
  inductors: InductorPart[];
  /** The winding entry used for every transformer winding: the first usable one (null when the library has none). */
  winding: WindingPart | null;
  drivers: Record<GateDriverPart['kind'], GateDriverPart | undefined>;
  byId: Map<string, unknown>;
  /** Unit prices resolved per annual volume (see `pricesAt`), most recent first. */
  priceCache: Map<number, PriceTable>;
  lastPrices: PriceTable | null;
}

/**
 * Unit prices of every indexed list at one annual volume, aligned with the sorted lists of the
 * index (`nMosfets[i]` costs `nMosfets[i]` of this table), resolved once with `unitPriceAt`.
 */
export interface PriceTable {
  volume: number;
  nMosfets: Float64Array;
  pMosfets: Float64Array;
  srMosfets: Float64Array;
  rectifiers: Float64Array;
  clampDiodes: Float64Array;
  coresByAp: Float64Array;
  capacitors: Float64Array;
  resistors: Float64Array;
  inductors: Float64Array;
  /** Labour price of one winding at this volume (0 without a winding entry). */
  windingLabour: number;
  lowSideDriver: number;
  highSideDriver: number;
}

const cache = new WeakMap<PartsLibrary, LibraryIndex>();

function usable<T extends { status: string }>(parts: T[]): T[] {
  return parts.filter((p) => p.status !== 'nfnd');
}

function cheapestDriver(parts: GateDriverPart[], kind: GateDriverPart['kind']): GateDriverPart | undefined {
  const ofKind = usable(parts).filter((d) => d.kind === kind);
  ofKind.sort((a, b) => (a.tiers[0]?.unitPrice ?? 0) - (b.tiers[0]?.unitPrice ?? 0));
  return ofKind[0];
}

/** Build (or fetch from cache) the index of a library. The library must not be mutated afterwards. */
export function indexLibrary(library: PartsLibrary): LibraryIndex {
  const hit = cache.get(library);
  if (hit) return hit;
  const byV = (a: MosfetPart, b: MosfetPart): number => a.vdsV - b.vdsV;
  const byVrrm = (a: RectifierPart, b: RectifierPart): number => a.vrrmV - b.vrrmV || a.ifA - b.ifA;
  const coresByAp = usable(library.cores).sort((a, b) => a.aeM2 * a.waM2 - b.aeM2 * b.waM2);
  const byId = new Map<string, unknown>();
  for (const list of [library.mosfets, library.srMosfets, library.rectifiers, library.clampDiodes,
    library.gateDrivers, library.cores, library.capacitors, library.resistors, library.inductors, library.windings ?? []]) {
    for (const p of list) byId.set(p.id, p);
  }
  const index: LibraryIndex = {
    library,
    nMosfets: usable(library.mosfets).filter((m) => m.channel === 'n').sort(byV),
    pMosfets: usable(library.mosfets).filter((m) => m.channel === 'p').sort(byV),
    srMosfets: usable(library.srMosfets).sort(byV),
    rectifiers: usable(library.rectifiers).sort(byVrrm),
    clampDiodes: usable(library.clampDiodes).sort(byVrrm),
    coresByAp,
    coreApM4: Float64Array.from(coresByAp, (c) => c.aeM2 * c.waM2),
    capacitors: usable(library.capacitors).sort((a, b) => a.voltageV - b.voltageV),
    resistors: usable(library.resistors).sort((a, b) => a.powerW - b.powerW),
    inductors: usable(library.inductors).sort((a, b) => a.energyJ - b.energyJ),
    winding: usable(library.windings ?? [])[0] ?? null,
    drivers: {
      'low-side': cheapestDriver(library.gateDrivers, 'low-side'),
      'bootstrap-high-side': cheapestDriver(library.gateDrivers, 'bootstrap-high-side'),
      isolated: cheapestDriver(library.gateDrivers, 'isolated'),
    },
    byId,
    priceCache: new Map(),
    lastPrices: null,
  };
  cache.set(library, index);
  return index;
}

/**
 * Unit price at an annual volume: the tier with the largest `minQty` not above the volume
 * (volume below every tier → the smallest tier). Common practice for distributor price breaks.
 */
export function unitPriceAt(tiersList: PriceTier[], annualVolume: number): number {
  let price = tiersList[0]?.unitPrice ?? 0;
  let best = -1;
  for (let i = 0; i < tiersList.length; i++) {
    const t = tiersList[i]!;
    if (t.minQty <= annualVolume && t.minQty > best) { best = t.minQty; price = t.unitPrice; }
  }
  return price;
}

const pricesOf = (list: readonly { tiers: PriceTier[] }[], volume: number): Float64Array =>
  Float64Array.from(list, (p) => unitPriceAt(p.tiers, volume));

/** Most price tables kept per library index (a sweep over volume stays well below this). */
const PRICE_CACHE_SIZE = 64;

/**
 * Unit prices of the whole index at an annual volume (same values as `unitPriceAt`, resolved
 * once per volume and cached on the index; common practice for distributor price breaks).
 */
export function pricesAt(index: LibraryIndex, annualVolume: number): PriceTable {
  const last = index.lastPrices;
  if (last !== null && last.volume === annualVolume) return last;
  let table = index.priceCache.get(annualVolume);
  if (!table) {
    if (index.priceCache.size >= PRICE_CACHE_SIZE) index.priceCache.clear();
    table = {
      volume: annualVolume,
      nMosfets: pricesOf(index.nMosfets, annualVolume),
      pMosfets: pricesOf(index.pMosfets, annualVolume),
      srMosfets: pricesOf(index.srMosfets, annualVolume),
      rectifiers: pricesOf(index.rectifiers, annualVolume),
      clampDiodes: pricesOf(index.clampDiodes, annualVolume),
      coresByAp: pricesOf(index.coresByAp, annualVolume),
      capacitors: pricesOf(index.capacitors, annualVolume),
      resistors: pricesOf(index.resistors, annualVolume),
      inductors: pricesOf(index.inductors, annualVolume),
      windingLabour: index.winding ? unitPriceAt(index.winding.tiers, annualVolume) : 0,
      lowSideDriver: index.drivers['low-side'] ? unitPriceAt(index.drivers['low-side'].tiers, annualVolume) : 0,
      highSideDriver: index.drivers['bootstrap-high-side'] ? unitPriceAt(index.drivers['bootstrap-high-side'].tiers, annualVolume) : 0,
    };
    index.priceCache.set(annualVolume, table);
  }
  index.lastPrices = table;
  return table;
}
