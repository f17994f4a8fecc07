import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { demoPartsLibrary, evaluateLean, parseSpecInput } from '../../src/engine';
import { decodeOverrides, encodeOverrides, handoffHref, readHandoff } from '../../src/stores/sweep-handoff';
import { DEFAULT_SETTINGS, frequencies, ownPlan, planSweep, settingsProblems, type SweepSettings } from '../../src/features/sweep/plan';
import { overrideOf, pointAt } from '../../src/features/sweep/points';
import { drawCloud, nearestInCloud, newCloud, paintCloud, rgbOf } from '../../src/features/sweep/cloud';
import { joinBounds, joinFronts, paretoFront, summarise } from '../../src/features/sweep/fronts';
import { assemble, warmPointsPerWorker } from '../../src/features/sweep/pool';
import { dealChunks, F, globalIndex, ownRanges, partRanges, planChunks, rangeCount, runSweep, STRIDE } from '../../src/features/sweep/run';

const parsed = parseSpecInput({ vinMinV: 18, vinNomV: 24, vinMaxV: 32, voutV: 5, ioutA: 10, fswHz: 200e3 });
if (!parsed.ok) throw new Error('spec');
const spec = parsed.value;

describe('sweep plan', () => {
  test('log-spaced frequencies from 50 kHz to 500 kHz (equal ratios; derived)', () => {
    const f = frequencies(50e3, 500e3, 3);
    expect(f).toEqual([50e3, 158114, 500e3]);
    expect(frequencies(100e3, 100e3, 5)).toEqual([100e3]);
  });

  test('settings problems are plain sentences', () => {
    expect(settingsProblems(DEFAULT_SETTINGS)).toEqual([]);
    expect(settingsProblems({ ...DEFAULT_SETTINGS, schemes: [], fswMinHz: 600e3, fswSteps: 0 })).toEqual([
      'Pick at least one reset scheme.', 'The lowest frequency must not exceed the highest.', 'Frequency steps must be a whole number from 1 to 40.',
    ]);
  });

  test('the count equals the points the run evaluates, and nfnd parts are never swept', () => {
    const plan = planSweep(spec, demoPartsLibrary, { ...DEFAULT_SETTINGS, fswSteps: 2, dutySteps: 2 });
    const data = new Float64Array(plan.total * STRIDE);
    expect(runSweep(spec, demoPartsLibrary, plan, data)).toBe(plan.total);
    const nfnd = new Set([...demoPartsLibrary.mosfets, ...demoPartsLibrary.rectifiers, ...demoPartsLibrary.cores].filter((p) => p.status === 'nfnd').map((p) => p.id));
    for (const id of [...plan.mainSwitches.flat(), ...plan.rectifiers, ...plan.cores]) expect(nfnd.has(id ?? '')).toBe(false);
    // Duty limits stay at or below each scheme's own design limit (its reset would break above it).
    plan.schemes.forEach((scheme, k) => {
      const own = evaluateLean(spec, scheme, demoPartsLibrary).dutyLimit;
      expect(Math.max(...plan.dutyLimits[k]!)).toBeCloseTo(own, 12);
      expect(Math.min(...plan.dutyLimits[k]!)).toBeCloseTo(0.6 * own, 12);
    });
  });

  test.each([
    ['the 18–32 V set', spec],
    ['a synchronous-rectifier brick', parseSpecInput({ vinMinV: 36, vinNomV: 48, vinMaxV: 75, voutV: 12, ioutA: 12.5, fswHz: 250e3, rectifier: 'synchronous' })],
  ])('every point of %s equals evaluateLean of that point alone (points sharing the front stages lose nothing)', (_, s) => {
    const one = 'ok' in s ? (s.ok ? s.value : null) : s;
    if (!one) throw new Error('spec');
    const plan = planSweep(one, demoPartsLibrary, { ...DEFAULT_SETTINGS, fswSteps: 2, dutySteps: 2 });
    expect(plan.mainSwitches.some((m) => m.length > 1)).toBe(true);
    const data = new Float64Array(plan.total * STRIDE);
    runSweep(one, demoPartsLibrary, plan, data);
    let shared = 0;
    for (let g = 0; g < plan.total; g++) {
      const o = g * STRIDE;
      const s = data[o + F.scheme]!, main = data[o + F.main]!, rect = data[o + F.rect]!, core = data[o + F.core]!;
      const scheme = plan.schemes[s]!;
      const partIds = { mainSwitch: main >= 0 ? plan.mainSwitches[s]![main]! : undefined, rectifier: rect >= 0 ? plan.rectifiers[rect]! : undefined, core: core >= 0 ? plan.cores[core]! : undefined };
      const alone = evaluateLean({ ...one, fswHz: data[o + F.fswHz]!, overrides: { [scheme]: { dutyLimit: data[o + F.dutyLimit]!, partIds } } }, scheme, demoPartsLibrary);
      if (main > 0) shared++;
      // Bit for bit, not close: the kept state is the same state.
      expect([data[o + F.turnsRatio], data[o + F.cost], data[o + F.lossW], data[o + F.efficiency], data[o + F.feasible]]).toEqual(
        [alone.turnsRatio, alone.bomCost, alone.lossW, alone.efficiency, alone.feasible && Number.isFinite(alone.bomCost) && Number.isFinite(alone.lossW) ? 1 : 0]);
    }
    expect(shared).toBeGreaterThan(plan.total / 3);
  });

  test('warm-up: 150,000 points per worker on one or two cores, the page total held at 300,000 beyond', () => {
    expect([1, 2, 3, 4, 8].map(warmPointsPerWorker)).toEqual([150_000, 150_000, 100_000, 75_000, 37_500]);
  });

  test('a plan and ranges that crossed to a worker (structured clone) come back from ownPlan and ownRanges unchanged, and sweep alike', () => {
    const plan = planSweep(spec, demoPartsLibrary, { ...DEFAULT_SETTINGS, fswSteps: 2, dutySteps: 2 });
    const own = ownPlan(structuredClone(plan), demoPartsLibrary);
    expect(own).toEqual(plan);
    expect(ownRanges(structuredClone([[0, 5], [9, 12]]))).toEqual([[0, 5], [9, 12]]);
    // An id the library lacks (a part removed meanwhile) is kept as sent: the engine reports it as unknown.
    expect(ownPlan({ ...plan, cores: ['no-such-core', null] }, demoPartsLibrary).cores).toEqual(['no-such-core', null]);
    const a = new Float64Array(plan.total * STRIDE), b = new Float64Array(plan.total * STRIDE);
    runSweep(spec, demoPartsLibrary, plan, a);
    runSweep(spec, demoPartsLibrary, own, b);
    expect(b).toEqual(a);
  });

  test('a progress callback returning false stops the run early', () => {
    const plan = planSweep(spec, demoPartsLibrary, { ...DEFAULT_SETTINGS, fswSteps: 2, dutySteps: 2 });
    const data = new Float64Array(plan.total * STRIDE);
    expect(runSweep(spec, demoPartsLibrary, plan, data, () => false, 10)).toBe(10);
  });
});

describe('Pareto front (both objectives minimised; derived)', () => {
  const build = (pts: [number, number, number][]): Float64Array => {
    const d = new Float64Array(pts.length * STRIDE);
    pts.forEach(([cost, loss, feasible], i) => { d[i * STRIDE + F.cost] = cost; d[i * STRIDE + F.lossW] = loss; d[i * STRIDE + F.feasible] = feasible; });
    return d;
  };
  test('table: dominated and infeasible points are left out, cheapest first', () => {
    const d = build([[5, 10, 1], [4, 12, 1], [6, 9, 1], [6, 11, 1], [3, 1, 0], [7, 9, 1], [8, 4, 1]]);
    expect(paretoFront(d, 7, null)).toEqual([1, 0, 2, 6]);
  });
  test('property: no front point is dominated and every other feasible point is', () => {
    fc.assert(fc.property(fc.array(fc.tuple(fc.integer({ min: 0, max: 50 }), fc.integer({ min: 0, max: 50 }), fc.constantFrom(0, 1)), { maxLength: 60 }), (pts) => {
      const d = build(pts);
      const front = new Set(paretoFront(d, pts.length, null));
      pts.forEach(([c, l, f], i) => {
        if (!f) { expect(front.has(i)).toBe(false); return; }
        const dominated = pts.some(([c2, l2, f2], j) => j !== i && f2 === 1 && c2 <= c && l2 <= l && (c2 < c || l2 < l));
        if (front.has(i)) expect(dominated).toBe(false);
        // Off the front: some front point is at least as cheap and at least as lossless.
        else expect([...front].some((k) => pts[k]![0] <= c && pts[k]![1] <= l)).toBe(true);
      });
    }));
  });
  test('property: the bucketed summary finds the same per-scheme fronts as the full sort, ties included', () => {
    fc.assert(fc.property(fc.array(fc.tuple(fc.integer({ min: 0, max: 2 }), fc.integer({ min: 0, max: 30 }), fc.integer({ min: 0, max: 30 }), fc.constantFrom(0, 1, 1)), { maxLength: 80 }), fc.integer({ min: 1, max: 16 }), (pts, buckets) => {
      const d = new Float64Array(pts.length * STRIDE);
      pts.forEach(([s, c, l, f], i) => { d[i * STRIDE] = s; d[i * STRIDE + F.cost] = c; d[i * STRIDE + F.lossW] = l; d[i * STRIDE + F.feasible] = f; });
      const sum = summarise(d, pts.length, 3, buckets);
      for (const s of [0, 1, 2]) expect(sum.fronts[s]).toEqual(paretoFront(d, pts.length, s));
      expect(sum.feasible).toBe(pts.filter((p) => p[3] === 1).length);
    }));
  });
  test('exact duplicates keep the lowest position (so part fronts join to the whole front)', () => {
    const d = build([[5, 5, 1], [5, 5, 1], [4, 6, 1]]);
    expect(paretoFront(d, 3, null)).toEqual([2, 0]);
  });
});

describe('sweep split across workers (derived: a partition of the plan)', () => {
  test.each([[0, 2], [1, 2], [1024, 2], [1025, 2], [101_920, 2], [5000, 3], [7, 1]])('%i points over %i parts: every index once, rising within a part', (total, parts) => {
    const shares = partRanges(total, parts);
    const seen = new Uint8Array(total);
    for (const ranges of shares) {
      let last = -1;
      ranges.forEach(([a, b], k) => { expect(a).toBeGreaterThan(last); expect(b).toBeGreaterThan(a); last = b - 1; for (let g = a; g < b; g++) seen[g]!++; expect(globalIndex(ranges, rangeCount(ranges.slice(0, k)))).toBe(a); });
    }
    expect(seen.every((n) => n === 1)).toBe(true);
    expect(shares.reduce((n, r) => n + rangeCount(r), 0)).toBe(total);
    // Interleaved chunks: no part gets more than one chunk more than another.
    const counts = shares.map((r) => r.length);
    expect(Math.max(...counts) - Math.min(...counts)).toBeLessThanOrEqual(1);
  });
  test.each<[string, Partial<SweepSettings>]>([
    ['default settings', {}],
    ['one frequency, one duty step, no part variation', { fswSteps: 1, dutySteps: 1, varyMainSwitch: false, varyRectifier: false, varyCore: false }],
    ['two schemes, 13 frequencies', { schemes: ['rcd-clamp', 'two-switch'], fswSteps: 13 }],
  ])('plan chunks (%s) end at whole front groups, about 1,024 points each, and dealt to two parts they cover the plan once', (_, over) => {
    const plan = planSweep(spec, demoPartsLibrary, { ...DEFAULT_SETTINGS, ...over });
    const bounds = planChunks(plan);
    expect(bounds[0]).toBe(0);
    expect(bounds.at(-1)).toBe(plan.total);
    // Each scheme's block and its group size (every main switch, rectifier and core of one frequency and duty limit).
    const blocks: [start: number, end: number, group: number][] = [];
    let start = 0;
    plan.schemes.forEach((_, s) => {
      const group = plan.mainSwitches[s]!.length * plan.rectifiers.length * plan.cores.length;
      const end = start + plan.fswHz.length * plan.dutyLimits[s]!.length * group;
      blocks.push([start, end, group]);
      start = end;
    });
    for (let k = 1; k < bounds.length; k++) {
      expect(bounds[k]!).toBeGreaterThan(bounds[k - 1]!);
      const [blockStart, , group] = blocks.find(([a, b]) => bounds[k]! > a && bounds[k]! <= b)!;
      expect((bounds[k]! - blockStart) % group).toBe(0);
      expect(bounds[k]! - bounds[k - 1]!).toBeLessThanOrEqual(Math.max(group, 1.5 * 1024));
    }
    const seen = new Uint8Array(plan.total);
    for (const ranges of dealChunks(bounds, 2)) for (const [a, b] of ranges) for (let g = a; g < b; g++) seen[g]!++;
    expect(seen.every((n) => n === 1)).toBe(true);
  });
  test('a sweep dealt in front-group chunks to two parts gives the numbers of the whole run', () => {
    const plan = planSweep(spec, demoPartsLibrary, { ...DEFAULT_SETTINGS, fswSteps: 2, dutySteps: 2 });
    const whole = new Float64Array(plan.total * STRIDE);
    runSweep(spec, demoPartsLibrary, plan, whole);
    for (const ranges of dealChunks(planChunks(plan, 300), 2)) {
      const data = new Float64Array(rangeCount(ranges) * STRIDE);
      runSweep(spec, demoPartsLibrary, plan, data, undefined, 5000, ranges);
      for (let local = 0; local < rangeCount(ranges); local++) {
        const g = globalIndex(ranges, local);
        expect(Array.from(data.subarray(local * STRIDE, (local + 1) * STRIDE))).toEqual(Array.from(whole.subarray(g * STRIDE, (g + 1) * STRIDE)));
      }
    }
  });
  test('a part count below one is refused', () => {
    expect(() => partRanges(10, 0)).toThrow(RangeError);
  });

  test('two parts, evaluated apart and assembled, equal the whole run: same numbers, fronts and extent', () => {
    const plan = planSweep(spec, demoPartsLibrary, { ...DEFAULT_SETTINGS, fswSteps: 3, dutySteps: 2 });
    const whole = new Float64Array(plan.total * STRIDE);
    expect(runSweep(spec, demoPartsLibrary, plan, whole)).toBe(plan.total);
    const shares = partRanges(plan.total, 2, 97);
    const parts = shares.map((ranges) => {
      const count = rangeCount(ranges);
      const data = new Float64Array(count * STRIDE);
      expect(runSweep(spec, demoPartsLibrary, plan, data, undefined, 5000, ranges)).toBe(count);
      const sum = summarise(data, count, plan.schemes.length);
      return { type: 'part' as const, job: 1, ranges, data, count, feasible: sum.feasible, bounds: sum.bounds, fronts: sum.fronts.map((f) => f.map((i) => globalIndex(ranges, i))), times: { receivedAt: 0, evaluatedAt: 0, summarisedAt: 0 }, arrivedAt: 0 };
    });
    const joined = assemble(plan, parts, 0);
    expect(joined.count).toBe(plan.total);
    expect(joined.data).toEqual(whole);
    plan.schemes.forEach((_, s) => expect(joined.fronts[s]).toEqual(paretoFront(whole, plan.total, s)));
    expect(joined.overall).toEqual(paretoFront(whole, plan.total, null));
    const all = summarise(whole, plan.total, plan.schemes.length);
    expect(joined.feasible).toBe(all.feasible);
    expect(joined.bounds).toEqual(all.bounds);
    expect(joined.feasible).toBeGreaterThan(0);
    expect(joinFronts(whole, [all.fronts], plan.schemes.length).fronts).toEqual(all.fronts);
  });
  test('joining extents skips parts with nothing feasible', () => {
    expect(joinBounds([{ feasible: 0, bounds: { costMin: 0, costMax: 0, lossMin: 0, lossMax: 0 } }, { feasible: 2, bounds: { costMin: 3, costMax: 4, lossMin: 1, lossMax: 2 } }]))
      .toEqual({ costMin: 3, costMax: 4, lossMin: 1, lossMax: 2 });
  });
});

describe('cloud bitmap and hover lookup', () => {
  // Three points: scheme 0 at cost 1 / loss 1, scheme 1 at cost 3 / loss 2, an infeasible one at cost 2 / loss 1.
  const d = new Float64Array(3 * STRIDE);
  [[0, 1, 1, 1], [1, 3, 2, 1], [0, 2, 1, 0]].forEach(([s, c, l, f], i) => { d[i * STRIDE] = s!; d[i * STRIDE + F.cost] = c!; d[i * STRIDE + F.lossW] = l!; d[i * STRIDE + F.feasible] = f!; });
  // 10 px per unit of cost from cost 0; loss 3 at the top, −10 px per W.
  const map = { costAt0: 0, xPerCost: 10, lossAt0: 3, yPerLoss: -10 };
  const layer = drawCloud(d, 3, [rgbOf('#2364aa'), rgbOf('#c75a12')], map, 40, 40, 2, 0.5, 8);
  const at = (x: number, y: number): number[] => Array.from(layer.pixels.slice((y * 40 + x) * 4, (y * 40 + x) * 4 + 4));
  test('each feasible point is a dot in its scheme colour, at the opacity asked; nothing else is painted', () => {
    expect(rgbOf('#2364aa')).toEqual([0x23, 0x64, 0xaa]);
    expect(at(10, 20)).toEqual([0x23, 0x64, 0xaa, 128]); // cost 1 → x 10, loss 1 → y 20
    expect(at(30, 10)).toEqual([0xc7, 0x5a, 0x12, 128]); // cost 3 → x 30, loss 2 → y 10
    expect(at(20, 20)[3]).toBe(0); // the infeasible point is not drawn
    let painted = 0;
    for (let p = 3; p < layer.pixels.length; p += 4) if (layer.pixels[p]! > 0) painted++;
    expect(painted).toBe(8); // two 2×2 dots
    expect(layer.drawn).toBe(2);
    expect(Number.isNaN(layer.px[2]!)).toBe(true);
  });
  test('overlapping dots deepen (source-over: 1 − (1 − a)²)', () => {
    const two = new Float64Array(2 * STRIDE);
    for (const i of [0, 1]) { two[i * STRIDE + F.cost] = 1; two[i * STRIDE + F.lossW] = 1; two[i * STRIDE + F.feasible] = 1; }
    const l = drawCloud(two, 2, [[0, 0, 0]], map, 40, 40, 2, 0.5);
    expect(Math.abs(l.pixels[(20 * 40 + 10) * 4 + 3]! - 0.75 * 255)).toBeLessThanOrEqual(1); // within one 8-bit step
  });
  test('painting in slices gives the same bitmap, hover buckets and count as painting at once', () => {
    const plan = planSweep(spec, demoPartsLibrary, { ...DEFAULT_SETTINGS, fswSteps: 2, dutySteps: 2, varyRectifier: false });
    const data = new Float64Array(plan.total * STRIDE);
    const n = runSweep(spec, demoPartsLibrary, plan, data);
    const { bounds } = summarise(data, n, plan.schemes.length);
    const m = { costAt0: bounds.costMin, xPerCost: 199 / (bounds.costMax - bounds.costMin), lossAt0: bounds.lossMax, yPerLoss: -99 / (bounds.lossMax - bounds.lossMin) };
    const colours = plan.schemes.map((_, k) => rgbOf(['#2364aa', '#c75a12', '#1f8a5b', '#8a3b9e', '#a07a00'][k]!));
    const whole = drawCloud(data, n, colours, m, 200, 100);
    const sliced = newCloud(n, 200, 100);
    for (let from = 0; from < n; from += 37) paintCloud(sliced, data, from, Math.min(n, from + 37), colours, m);
    expect(sliced.pixels).toEqual(whole.pixels);
    expect(sliced.head).toEqual(whole.head);
    expect(sliced.next).toEqual(whole.next);
    expect(sliced.drawn).toBe(whole.drawn);
    expect(whole.drawn).toBe(summarise(data, n, plan.schemes.length).feasible);
  });
  test('the nearest drawn point within the radius, or −1', () => {
    expect(nearestInCloud(layer, 12, 19, 6)).toBe(0);
    expect(nearestInCloud(layer, 27, 12, 6)).toBe(1);
    expect(nearestInCloud(layer, 20, 20, 6)).toBe(-1); // only the infeasible point is near
    expect(nearestInCloud(layer, 0, 39, 6)).toBe(-1);
  });
});

describe('hand-over to Compare', () => {
  test('round trip through the address, with the frequency', () => {
    const overrides = { 'active-clamp': { dutyLimit: 0.42, partIds: { mainSwitch: 'demo-nmos-150v-a', core: 'demo-core-etd29' } } };
    expect(decodeOverrides(encodeOverrides(overrides))).toEqual({ ok: true, value: overrides });
    const href = handoffHref('demo-spec-1', 'active-clamp', overrides['active-clamp'], 180e3);
    expect(href).toMatch(/^\/compare\/demo-spec-1\?overrides=[A-Za-z0-9_-]+&fswHz=180000$/);
    expect(readHandoff(href.slice(href.indexOf('?')))).toEqual({ ok: true, value: { overrides, fswHz: 180e3 } });
    expect(readHandoff('?other=1')).toBeNull();
  });
  test.each([
    ['not base64 JSON', '%%%', /could not be read/],
    ['an array', Buffer.from('[1]').toString('base64url'), /not a set of scheme overrides/],
    ['an unknown scheme', Buffer.from('{"flyback":{}}').toString('base64url'), /unknown scheme \(flyback\)/],
    ['a duty limit out of range', Buffer.from('{"two-switch":{"dutyLimit":3}}').toString('base64url'), /Two-switch is not valid: dutyLimit/],
    ['an unknown field', Buffer.from('{"two-switch":{"dutyLimit":0.4,"fsw":1}}').toString('base64url'), /Two-switch is not valid/],
    ['nothing', Buffer.from('{}').toString('base64url'), /carries no overrides/],
  ])('refuses %s with a plain message', (_what, param, message) => {
    const r = decodeOverrides(param);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(message);
  });
  test('a frequency outside 10 kHz – 5 MHz is refused', () => {
    const q = `?overrides=${encodeOverrides({ 'two-switch': { dutyLimit: 0.4 } })}&fswHz=1e9`;
    expect(readHandoff(q)).toEqual({ ok: false, message: "The sweep point's switching frequency must lie between 10 kHz and 5 MHz." });
  });
  test('a sweep point re-evaluated on Compare gives the same cost and loss (same lean engine, same overrides)', async () => {
    const { evaluateNormalised } = await import('../../src/engine');
    const plan = planSweep(spec, demoPartsLibrary, { ...DEFAULT_SETTINGS, schemes: ['two-switch'], fswSteps: 2, dutySteps: 2 });
    const data = new Float64Array(plan.total * STRIDE);
    const n = runSweep(spec, demoPartsLibrary, plan, data);
    const i = paretoFront(data, n, null)[0]!;
    const p = pointAt(plan, data, i);
    const full = evaluateNormalised({ ...spec, fswHz: p.fswHz, schemes: ['two-switch'], overrides: { 'two-switch': overrideOf(p) } }, demoPartsLibrary).results[0]!;
    expect(full.bomCost).toBeCloseTo(p.cost, 6);
    expect(full.lossesW.total).toBeCloseTo(p.lossW, 6);
  });
});
