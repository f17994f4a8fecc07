import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { demoPartsLibrary, evaluateLean, parseSpecInput } from '../../src/engine';
import { decodeOverrides, encodeOverrides, handoffHref, readHandoff } from '../../src/features/sweep/handoff';
import { DEFAULT_SETTINGS, frequencies, planSweep, settingsProblems } from '../../src/features/sweep/plan';
import { overrideOf, pointAt } from '../../src/features/sweep/points';
import { F, paretoFront, runSweep, STRIDE, thinForDisplay } from '../../src/features/sweep/run';

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
  test('thinning keeps every scheme represented and never more points than it got', () => {
    const plan = planSweep(spec, demoPartsLibrary, { ...DEFAULT_SETTINGS, fswSteps: 2, dutySteps: 2, varyRectifier: false });
    const data = new Float64Array(plan.total * STRIDE);
    const n = runSweep(spec, demoPartsLibrary, plan, data);
    const { clouds } = thinForDisplay(data, n, plan.schemes.length);
    expect(clouds.reduce((s, c) => s + c.length, 0)).toBeLessThanOrEqual(n);
    for (const c of clouds) for (const i of c) expect(data[i * STRIDE + F.feasible]).toBe(1);
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
