import type {
  CapacitorPart, CorePart, CoreShapeFamily, GateDriverPart, InductorPart, MosfetPart, PartsLibrary,
  PriceTier, RectifierPart, ResistorPart, WindingPart,
} from './types';

/**
 * Built-in DEMO parts library. Every part, value and price is invented for Resetwise's
 * fictional demo workspace; ids start with `demo-` and no real product stands behind them.
 * Values are plausible orders of magnitude for early trade-off studies, not data of any part.
 */

/** Volume tiers from a 10 k-piece base price: ×1.6 for samples, ×1.15 from 1 k, ×0.85 from 100 k. */
function tiers(base: number): PriceTier[] {
  return [
    { minQty: 1, unitPrice: round(base * 1.6) },
    { minQty: 1000, unitPrice: round(base * 1.15) },
    { minQty: 10000, unitPrice: round(base) },
    { minQty: 100000, unitPrice: round(base * 0.85) },
  ];
}

function round(x: number): number {
  return Math.round(x * 1000) / 1000;
}

type FetRow = [vdsV: number, idA: number, rdsOnMilliOhm: number, qgNanoC: number, cossPicoF: number, price: number];

function fets(prefix: string, channel: 'n' | 'p', rows: FetRow[]): MosfetPart[] {
  return rows.map(([vdsV, idA, rds, qg, coss, price], i) => ({
    id: `${prefix}-${vdsV}v-${String.fromCharCode(97 + (rows.slice(0, i).filter((r) => r[0] === vdsV).length))}`,
    status: 'preferred', tiers: tiers(price), channel, vdsV, idA,
    rdsOnOhm: rds * 1e-3, qgC: qg * 1e-9, cossF: coss * 1e-12,
  }));
}

const mosfets: MosfetPart[] = [
  ...fets('demo-nmos', 'n', [
    [40, 90, 3.5, 35, 700, 0.38], [60, 80, 5, 40, 500, 0.45], [80, 70, 6.5, 45, 450, 0.55],
    [100, 30, 20, 18, 150, 0.35], [100, 60, 8, 50, 400, 0.62], [150, 45, 15, 45, 300, 0.8],
    [200, 35, 25, 40, 250, 0.95], [250, 28, 40, 40, 200, 1.1], [300, 20, 60, 35, 150, 1.2],
    [400, 12, 150, 30, 100, 1.1], [500, 12, 200, 30, 80, 1.15], [600, 11, 280, 20, 40, 0.95],
    [600, 20, 120, 40, 80, 1.6], [650, 24, 100, 45, 90, 1.9], [700, 18, 150, 40, 70, 2.0],
    [800, 15, 250, 45, 60, 2.3], [900, 12, 340, 60, 60, 2.9], [950, 11, 400, 55, 50, 3.1],
    [1000, 10, 500, 70, 60, 3.6], [1200, 19, 160, 50, 60, 5.5], [1500, 4, 2000, 60, 50, 6.0],
    [1700, 6, 750, 20, 30, 8.5],
  ]),
  ...fets('demo-pmos', 'p', [
    [60, 30, 25, 40, 400, 0.5], [100, 20, 60, 45, 300, 0.7], [150, 12, 150, 40, 200, 0.95],
    [200, 8, 300, 35, 150, 1.2],
  ]),
];

const srMosfets: MosfetPart[] = fets('demo-sr', 'n', [
  [30, 100, 1.2, 40, 1200, 0.4], [40, 100, 1.5, 45, 1000, 0.45], [60, 100, 2.5, 60, 900, 0.6],
  [80, 100, 3.5, 70, 800, 0.75], [100, 100, 4.5, 75, 700, 0.9], [150, 80, 9, 70, 500, 1.2],
  [200, 60, 18, 60, 400, 1.4],
]);

type DiodeRow = [kind: 'schottky' | 'ultrafast', vrrmV: number, ifA: number, vfV: number, qrrNanoC: number, price: number];

function diodes(prefix: string, rows: DiodeRow[]): RectifierPart[] {
  return rows.map(([kind, vrrmV, ifA, vfV, qrr, price]) => ({
    id: `${prefix}-${kind === 'schottky' ? 'sch' : 'uf'}-${vrrmV}v-${ifA}a`,
    status: 'preferred', tiers: tiers(price), kind, vrrmV, ifA, vfV, qrrC: qrr * 1e-9,
  }));
}

const rectifiers = diodes('demo-rect', [
  ['schottky', 45, 20, 0.5, 0, 0.35], ['schottky', 45, 40, 0.52, 0, 0.6], ['schottky', 60, 20, 0.55, 0, 0.4],
  ['schottky', 60, 40, 0.58, 0, 0.7], ['schottky', 100, 20, 0.65, 0, 0.5], ['schottky', 100, 40, 0.7, 0, 0.85],
  ['schottky', 150, 20, 0.75, 0, 0.6], ['schottky', 200, 20, 0.85, 0, 0.7],
  ['ultrafast', 200, 30, 0.95, 35, 0.55], ['ultrafast', 400, 30, 1.1, 50, 0.65], ['ultrafast', 600, 30, 1.3, 80, 0.8],
]);

const clampDiodes = diodes('demo-clamp', [
  ['ultrafast', 200, 2, 0.9, 20, 0.08], ['ultrafast', 600, 2, 1.2, 30, 0.1], ['ultrafast', 1000, 2, 1.5, 45, 0.16],
  ['ultrafast', 1300, 1, 1.7, 50, 0.28],
]);

const gateDrivers: GateDriverPart[] = [
  { id: 'demo-drv-lowside-a', kind: 'low-side', peakA: 4, status: 'preferred', tiers: tiers(0.35) },
  { id: 'demo-drv-halfbridge-a', kind: 'bootstrap-high-side', peakA: 3, status: 'preferred', tiers: tiers(0.7) },
  { id: 'demo-drv-isolated-a', kind: 'isolated', peakA: 4, status: 'allowed', tiers: tiers(1.5) },
];

type CoreRow = [family: CoreShapeFamily, size: string, aeMm2: number, leMm: number, veMm3: number, waMm2: number, mltMm: number, price: number];

/** Ungapped set of an invented generic MnZn power ferrite: µe ≈ 1800; k, α, β fitted to ~100 kW/m³ at 100 kHz, 100 mT. */
function cores(rows: CoreRow[]): CorePart[] {
  return rows.map(([family, size, ae, le, ve, wa, mlt, price]) => ({
    id: `demo-core-${family.toLowerCase()}${size.replace(/\//g, '-')}`,
    status: 'preferred', tiers: tiers(price), shapeFamily: family, size,
    aeM2: ae * 1e-6, leM: le * 1e-3, veM3: ve * 1e-9, waM2: wa * 1e-6, mltM: mlt * 1e-3,
    alH: (4e-7 * Math.PI * 1800 * ae * 1e-6) / (le * 1e-3),
    steinmetzK: 3.98, steinmetzAlpha: 1.4, steinmetzBeta: 2.6, bsatT: 0.39, brT: 0.1,
  }));
}

const coreList = cores([
  ['EFD', '20', 31, 47, 1460, 50, 38, 0.35], ['RM', '8', 64, 38, 2430, 30, 42, 0.55],
  ['E', '25/13/7', 52, 57, 2990, 78, 50, 0.4], ['PQ', '20/20', 62, 46, 2850, 33, 44, 0.6],
  ['ETD', '29', 76, 72, 5470, 97, 53, 0.7], ['PQ', '26/25', 120, 55, 6530, 60, 56, 0.85],
  ['ETD', '34', 97, 79, 7640, 123, 61, 0.9], ['ETD', '39', 125, 92, 11500, 177, 69, 1.2],
  ['PQ', '32/30', 160, 75, 12000, 100, 67, 1.3], ['PQ', '35/35', 190, 88, 16700, 170, 75, 1.7],
  ['ETD', '44', 173, 103, 17800, 214, 78, 1.8], ['ETD', '49', 211, 114, 24000, 273, 86, 2.4],
  ['PQ', '40/40', 200, 102, 20500, 250, 84, 2.3], ['ETD', '59', 368, 139, 51500, 366, 106, 4.2],
]);

type CapRow = [dielectric: CapacitorPart['dielectric'], capMicroF: number, voltageV: number, esrMilliOhm: number, price: number];

const capacitors: CapacitorPart[] = ([
  ['ceramic', 22, 25, 3, 0.12], ['ceramic', 47, 10, 3, 0.1], ['polymer', 680, 6.3, 8, 0.35],
  ['polymer', 330, 16, 10, 0.3], ['polymer', 150, 25, 15, 0.32], ['electrolytic', 470, 35, 60, 0.2],
  ['ceramic', 1, 100, 10, 0.06], ['film', 0.47, 250, 20, 0.18], ['film', 0.22, 630, 30, 0.25],
  ['film', 0.1, 1000, 40, 0.35], ['ceramic', 0.0022, 1000, 100, 0.04],
] as CapRow[]).map(([dielectric, c, voltageV, esr, price]) => ({
  id: `demo-cap-${dielectric}-${c}uf-${voltageV}v`.replace('.', 'p'),
  status: 'preferred', tiers: tiers(price), dielectric,
  capacitanceF: c * 1e-6, voltageV, esrOhm: esr * 1e-3,
}));

const resistors: ResistorPart[] = [
  { id: 'demo-res-0w25', powerW: 0.25, voltageV: 200, status: 'preferred', tiers: tiers(0.01) },
  { id: 'demo-res-1w', powerW: 1, voltageV: 500, status: 'preferred', tiers: tiers(0.05) },
  { id: 'demo-res-3w', powerW: 3, voltageV: 750, status: 'preferred', tiers: tiers(0.15) },
  { id: 'demo-res-10w', powerW: 10, voltageV: 1000, status: 'preferred', tiers: tiers(0.6) },
  { id: 'demo-res-25w', powerW: 25, voltageV: 1000, status: 'allowed', tiers: tiers(1.8) },
];

const inductors: InductorPart[] = ([
  [0.25e-3, 900, 0.6], [0.6e-3, 600, 0.9], [1.5e-3, 380, 1.4], [4e-3, 250, 2.2], [10e-3, 160, 3.5], [25e-3, 100, 5.5],
] as [number, number, number][]).map(([energyJ, dcrOhmPerH, price]) => ({
  id: `demo-ind-${Math.round(energyJ * 1e6)}uj`, status: 'preferred', tiers: tiers(price), energyJ, dcrOhmPerH,
}));

/** Invented winding-shop price: labour per winding from 0.12 at 10 k pieces, copper wire at 11 per kg. */
const windings: WindingPart[] = [
  { id: 'demo-winding-shop-a', description: 'Labour of one transformer winding; its copper priced per kg (invented)', status: 'preferred', tiers: tiers(0.12), copperPricePerKg: 11 },
];

/** The invented demo library the engine uses when no other library is given. */
export const demoPartsLibrary: PartsLibrary = {
  name: 'Resetwise demo parts (invented)',
  version: '2025.1-demo',
  currency: 'EUR',
  demo: true,
  note: 'Demo data: every part, value and price is invented for illustration. No manufacturer or real part number.',
  mosfets, srMosfets, rectifiers, clampDiodes, gateDrivers, cores: coreList, capacitors, resistors, inductors, windings,
};
