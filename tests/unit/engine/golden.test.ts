/**
 * Golden reference: a fixed, seeded set of ~300 requirement sets (the three examples plus
 * deterministic variations) evaluated with `evaluate` (every scheme) and `evaluateLean` (each
 * scheme), compared with a snapshot generated from the engine before its performance work.
 * Numbers must agree to a relative 1e-12 (floating-point reordering only), strings, booleans,
 * nulls and the shape of every result exactly. Source: derived (regression reference of this engine).
 *
 * Regenerate (only on purpose, in its own commit, saying why):
 *   RESETWISE_GOLDEN=write npx vitest run tests/unit/engine/golden.test.ts
 * Regenerate after a change of trace source texts only (every other leaf must still match):
 *   RESETWISE_GOLDEN=sources npx vitest run tests/unit/engine/golden.test.ts
 */
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { describe, expect, test } from 'vitest';
import { evaluate, evaluateLean, SCHEME_IDS } from '../../../src/engine/index';
import { spec } from './helpers';

const ROOT = join(import.meta.dirname, '../../..');
const SNAPSHOT = join(import.meta.dirname, '__golden__/results.json');
const REL_TOL = 1e-12;
const MODE = process.env.RESETWISE_GOLDEN ?? 'check';

// ---------------------------------------------------------------------------------------------
// The cases: examples + seeded variations (a 32-bit LCG, Numerical Recipes constants).

type Raw = Record<string, unknown>;

function lcg(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 2 ** 32;
  };
}

const pick = <T,>(rnd: () => number, list: readonly T[]): T => list[Math.floor(rnd() * list.length)]!;

const EXAMPLES = ['telecom-brick-36-75v-12v', 'server-380v-bus-12v-500w', 'industrial-24v-5v-50w'] as const;

function variation(base: Raw, rnd: () => number): Raw {
  const vinScale = pick(rnd, [0.5, 0.8, 1, 1.25, 2]);
  const voutScale = pick(rnd, [0.5, 1, 2]);
  const ioutScale = pick(rnd, [0.2, 1, 2.5]);
  const fswScale = pick(rnd, [0.5, 1, 2, 4]);
  const v = (k: string): number => base[k] as number;
  const raw: Raw = {
    ...base,
    vinMinV: v('vinMinV') * vinScale,
    vinNomV: v('vinNomV') * vinScale,
    vinMaxV: Math.min(1500, v('vinMaxV') * vinScale),
    voutV: v('voutV') * voutScale,
    voutRippleV: v('voutRippleV') * voutScale,
    ioutA: v('ioutA') * ioutScale,
    fswHz: v('fswHz') * fswScale,
    rectifier: pick(rnd, ['diode', 'synchronous']),
    activeClampVariant: pick(rnd, ['high-side', 'low-side']),
    annualVolume: pick(rnd, [1, 100, 1000, 5000, 20000, 100000, 1000000]),
  };
  // Less frequent knobs, so the rarer branches are covered too.
  const extra = rnd();
  if (extra < 0.1) raw.resetTurnsRatio = pick(rnd, [0.6, 1.5]);
  else if (extra < 0.2) raw.maxDuty = pick(rnd, [0.45, 0.6]);
  else if (extra < 0.3) raw.leakageRatio = pick(rnd, [0, 0.01, 0.05]);
  else if (extra < 0.35) { delete raw.targetEfficiency; delete raw.targetUnitCost; }
  else if (extra < 0.4) raw.rippleRatio = pick(rnd, [0.1, 0.6]);
  return raw;
}

/** Overrides exercise the forced-part and fixed-ratio paths (part ids from the demo library). */
const OVERRIDES: Raw[] = [
  { 'two-switch': { turnsRatio: 0.4 }, 'rcd-clamp': { dutyLimit: 0.4 } },
  { 'tertiary-winding': { turnsPrimary: 12 }, 'active-clamp': { turnsPrimary: 5 } },
  { 'active-clamp': { partIds: { mainSwitch: 'demo-nmos-250v-a', core: 'demo-core-etd34' } } },
  { 'resonant-reset': { partIds: { rectifier: 'demo-sr-80v-a', core: 'demo-core-pq26-25' } } },
  { 'two-switch': { partIds: { mainSwitch: 'no-such-part' } }, 'rcd-clamp': { partIds: { core: 'demo-nmos-40v-a' } } },
  { 'tertiary-winding': { partIds: { rectifier: 'demo-rect-sch-60v-40a' } } },
];

interface Case { name: string; raw: Raw }

function cases(): Case[] {
  const bases = EXAMPLES.map((name) => ({ name, raw: JSON.parse(readFileSync(join(ROOT, 'examples', `${name}.json`), 'utf8')) as Raw }));
  const out: Case[] = bases.map((b) => ({ name: b.name, raw: b.raw }));
  bases.forEach((b, k) => {
    const rnd = lcg(20240601 + k);
    for (let j = 0; j < 95; j++) out.push({ name: `${b.name}/v${j}`, raw: variation(b.raw, rnd) });
  });
  OVERRIDES.forEach((overrides, j) => {
    const b = bases[j % bases.length]!;
    out.push({ name: `${b.name}/override${j}`, raw: { ...b.raw, overrides } });
  });
  return out;
}

// ---------------------------------------------------------------------------------------------
// Compact encoding: every result is flattened into leaves along "path:type" entries; paths,
// strings and leaf layouts ("shapes") are stored once in tables.

type Leaf = number | string | boolean | null;
interface Flat { paths: string[]; leaves: Leaf[] }

function flatten(value: unknown, path: string, out: Flat): void {
  if (typeof value === 'number') {
    if (Number.isFinite(value)) { out.paths.push(`${path}:n`); out.leaves.push(value); } else { out.paths.push(`${path}:x`); out.leaves.push(String(value)); }
  } else if (typeof value === 'string') { out.paths.push(`${path}:s`); out.leaves.push(value); }
  else if (typeof value === 'boolean') { out.paths.push(`${path}:b`); out.leaves.push(value); }
  else if (value === null) { out.paths.push(`${path}:z`); out.leaves.push(null); }
  else if (value === undefined) { out.paths.push(`${path}:u`); out.leaves.push(null); }
  else if (Array.isArray(value)) {
    if (value.length === 0) { out.paths.push(`${path}:[]`); out.leaves.push(null); }
    value.forEach((v, k) => flatten(v, `${path}.${k}`, out));
  } else if (typeof value === 'object') {
    const keys = Object.keys(value);
    if (keys.length === 0) { out.paths.push(`${path}:{}`); out.leaves.push(null); }
    for (const key of keys) flatten((value as Record<string, unknown>)[key], path ? `${path}.${key}` : key, out);
  } else throw new TypeError(`unexpected ${typeof value} at ${path}`);
}

interface Snapshot {
  about: string;
  relTol: number;
  paths: string[];
  strings: string[];
  shapes: number[][];
  cases: { name: string; input: Raw; comparison: [number, Leaf[]][]; lean: [number, Leaf[]][] }[];
}

class Tables {
  paths: string[] = [];
  strings: string[] = [];
  shapes: number[][] = [];
  private pathIx = new Map<string, number>();
  private stringIx = new Map<string, number>();
  private shapeIx = new Map<string, number>();
  private intern(map: Map<string, number>, list: string[], s: string): number {
    let ix = map.get(s);
    if (ix === undefined) { ix = list.length; list.push(s); map.set(s, ix); }
    return ix;
  }
  encode(value: unknown): [number, Leaf[]] {
    const f: Flat = { paths: [], leaves: [] };
    flatten(value, '', f);
    const shape = f.paths.map((p) => this.intern(this.pathIx, this.paths, p));
    const key = shape.join(',');
    let sx = this.shapeIx.get(key);
    if (sx === undefined) { sx = this.shapes.length; this.shapes.push(shape); this.shapeIx.set(key, sx); }
    const leaves = f.leaves.map((l, k) => (f.paths[k]!.endsWith(':s') ? this.intern(this.stringIx, this.strings, l as string) : l));
    return [sx, leaves];
  }
}

/** Decode a stored entry back to its flat form (paths and leaves with strings resolved). */
function decode(s: Snapshot, [sx, leaves]: [number, Leaf[]]): Flat {
  const paths = s.shapes[sx]!.map((p) => s.paths[p]!);
  return { paths, leaves: leaves.map((l, k) => (paths[k]!.endsWith(':s') ? s.strings[l as number]! : l)) };
}

/**
 * Current engine output for a case, split into parts that share layouts well: the comparison
 * without its results, each scheme result, and each lean result.
 */
function current(raw: Raw): { comparison: unknown[]; lean: unknown[] } {
  const normalised = spec(raw);
  const { results, ...top } = evaluate(raw);
  return { comparison: [top, ...results], lean: SCHEME_IDS.map((id) => evaluateLean(normalised, id)) };
}

function closeEnough(a: number, b: number): boolean {
  return a === b || Math.abs(a - b) <= REL_TOL * Math.max(Math.abs(a), Math.abs(b));
}

/**
 * Differences between a stored and a current flat result: shape first, then every leaf.
 * `ignore(path)` lets the sources-only regeneration accept changed source texts.
 */
function differences(stored: Flat, now: Flat, ignore: (path: string) => boolean = () => false): string[] {
  const out: string[] = [];
  if (stored.paths.length !== now.paths.length || stored.paths.some((p, k) => p !== now.paths[k])) {
    const k = stored.paths.findIndex((p, j) => p !== now.paths[j]);
    return [`shape differs at leaf ${k}: stored ${stored.paths[k] ?? '(end)'} vs now ${now.paths[k] ?? '(end)'}`];
  }
  for (let k = 0; k < stored.paths.length && out.length < 10; k++) {
    const p = stored.paths[k]!;
    const a = stored.leaves[k];
    const b = now.leaves[k];
    const same = p.endsWith(':n') ? closeEnough(a as number, b as number) : a === b;
    if (!same && !ignore(p)) out.push(`${p}: stored ${JSON.stringify(a)} vs now ${JSON.stringify(b)}`);
  }
  return out;
}

function writeSnapshot(s: Snapshot): void {
  // One case per line so that a regeneration shows up as a readable diff.
  const lines = [
    '{',
    `"about": ${JSON.stringify(s.about)},`,
    `"relTol": ${s.relTol},`,
    `"paths": [\n${s.paths.map((p) => JSON.stringify(p)).join(',\n')}\n],`,
    `"strings": [\n${s.strings.map((p) => JSON.stringify(p)).join(',\n')}\n],`,
    `"shapes": [\n${s.shapes.map((p) => JSON.stringify(p)).join(',\n')}\n],`,
    `"cases": [\n${s.cases.map((c) => JSON.stringify(c)).join(',\n')}\n]`,
    '}',
  ];
  mkdirSync(dirname(SNAPSHOT), { recursive: true });
  writeFileSync(SNAPSHOT, `${lines.join('\n')}\n`);
}

function build(list: Case[]): Snapshot {
  const t = new Tables();
  const out = list.map((c) => {
    const r = current(c.raw);
    return { name: c.name, input: c.raw, comparison: r.comparison.map((x) => t.encode(x)), lean: r.lean.map((l) => t.encode(l)) };
  });
  return {
    about: 'Golden engine results (evaluate and evaluateLean per scheme); see tests/unit/engine/golden.test.ts',
    relTol: REL_TOL, paths: t.paths, strings: t.strings, shapes: t.shapes, cases: out,
  };
}

const CASES = cases();

describe('golden engine results (regression reference; derived)', () => {
  test('the case list is the fixed, seeded one (~300 specs, all valid)', () => {
    expect(CASES.length).toBe(3 + 3 * 95 + OVERRIDES.length);
    for (const c of CASES) expect(() => spec(c.raw), c.name).not.toThrow();
  });

  if (MODE === 'write') {
    test('write snapshot', () => { writeSnapshot(build(CASES)); });
    return;
  }

  if (MODE === 'sources') {
    test('rewrite snapshot where only trace source texts changed', () => {
      const old = JSON.parse(readFileSync(SNAPSHOT, 'utf8')) as Snapshot;
      const next = build(CASES);
      const onlySource = (p: string): boolean => /\.source:s$/.test(p);
      old.cases.forEach((c, k) => {
        const n = next.cases[k]!;
        expect(n.name).toBe(c.name);
        expect(n.comparison).toHaveLength(c.comparison.length);
        c.comparison.forEach((x, j) => expect(differences(decode(old, x), decode(next, n.comparison[j]!), onlySource), c.name).toEqual([]));
        c.lean.forEach((l, j) => expect(differences(decode(old, l), decode(next, n.lean[j]!)), c.name).toEqual([]));
      });
      writeSnapshot(next);
    });
    return;
  }

  test('snapshot exists (generate it with RESETWISE_GOLDEN=write)', () => {
    expect(existsSync(SNAPSHOT)).toBe(true);
  });

  const stored: Snapshot | null = existsSync(SNAPSHOT) ? (JSON.parse(readFileSync(SNAPSHOT, 'utf8')) as Snapshot) : null;

  test('snapshot holds the same cases and inputs', () => {
    expect(stored).not.toBeNull();
    expect(stored!.cases.map((c) => c.name)).toEqual(CASES.map((c) => c.name));
    expect(stored!.cases.map((c) => c.input)).toEqual(CASES.map((c) => c.raw));
  });

  test.each(CASES.map((c, k) => [c.name, k] as const))('%s: evaluate and evaluateLean match the snapshot', (_name, k) => {
    const c = stored!.cases[k]!;
    const now = current(CASES[k]!.raw);
    const t = new Tables();
    const nowSnap: Snapshot = { ...stored!, paths: t.paths, strings: t.strings, shapes: t.shapes };
    expect(now.comparison).toHaveLength(c.comparison.length);
    now.comparison.forEach((x, j) => expect(differences(decode(stored!, c.comparison[j]!), decode(nowSnap, t.encode(x))), j === 0 ? 'comparison' : SCHEME_IDS[j - 1]).toEqual([]));
    expect(now.lean).toHaveLength(c.lean.length);
    now.lean.forEach((l, j) => expect(differences(decode(stored!, c.lean[j]!), decode(nowSnap, t.encode(l))), SCHEME_IDS[j]).toEqual([]));
  });
});

describe('golden comparison helper (self-check, so the reference test can fail)', () => {
  test('a relative change above 1e-12 is reported, one below is not', () => {
    const a: Flat = { paths: ['x:n', 'y:s'], leaves: [1.5, 'a'] };
    expect(differences(a, { paths: a.paths, leaves: [1.5 * (1 + 1e-13), 'a'] })).toEqual([]);
    expect(differences(a, { paths: a.paths, leaves: [1.5 * (1 + 1e-11), 'a'] })).toHaveLength(1);
    expect(differences(a, { paths: a.paths, leaves: [1.5, 'b'] })).toHaveLength(1);
    expect(differences(a, { paths: ['x:n', 'z:s'], leaves: [1.5, 'a'] })).toHaveLength(1);
  });
  test('NaN and null are kept apart by the encoding', () => {
    const f1: Flat = { paths: [], leaves: [] };
    const f2: Flat = { paths: [], leaves: [] };
    flatten({ v: NaN }, '', f1);
    flatten({ v: null }, '', f2);
    expect(differences(f1, f2)).toHaveLength(1);
  });
});
