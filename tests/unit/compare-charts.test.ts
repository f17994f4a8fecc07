import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, test } from 'vitest';
import { demoPartsLibrary, evaluate, sweepVin, waveforms, type Comparison } from '../../src/engine/index';
import { SCHEME_STYLES } from '../../src/lib/scheme-style';
import { formatDuty, formatMoney, formatVolts, formatWatts } from '../../src/lib/format';
import { stackColours } from '../../src/features/compare/charts/palette';
import { buildCostStacks, buildLossStacks, costGroupOf, LOSS_CATEGORIES } from '../../src/features/compare/charts/stacks';
import { buildDutySeries, buildStressSeries, buildSweeps, markerRadii, markerSlot, SWEEP_POINTS } from '../../src/features/compare/charts/sweep-series';
import { buildWaveSeries, cornerRadii } from '../../src/features/compare/charts/wave-series';

const EXAMPLES = join(import.meta.dirname, '../../examples');
const files = readdirSync(EXAMPLES).filter((f) => f.endsWith('.json')).sort();
const comparisons: [string, Comparison][] = files.map((f) => [f, evaluate(JSON.parse(readFileSync(join(EXAMPLES, f), 'utf8')))]);

test('the three demo examples are found', () => {
  expect(files).toHaveLength(3);
});

describe.each(comparisons)('%s', (_name, c) => {
  test('stress series: one curve per scheme in the scheme style, equal to sweepVin, plus its rating line', () => {
    const s = buildStressSeries(buildSweeps(c, demoPartsLibrary));
    expect(s.lines.map((d) => d.scheme)).toEqual(c.results.map((r) => r.scheme));
    for (const [k, r] of c.results.entries()) {
      const line = s.lines[k]!;
      const sweep = sweepVin(c.input, r.scheme, SWEEP_POINTS);
      expect(line.data).toHaveLength(SWEEP_POINTS);
      expect(line.data[0]).toEqual({ x: c.input.vinMinV, y: sweep[0]!.switchV });
      expect(line.data.at(-1)!.x).toBeCloseTo(c.input.vinMaxV, 9);
      expect(line.data.at(-1)!.y).toBe(sweep.at(-1)!.switchV);
      // The sweep's highest steady off-state voltage is the result's peak (the ends of the range for these schemes).
      expect(Math.max(...line.data.map((p) => p.y))).toBeCloseTo(r.switchPeakV, 6);
      const style = SCHEME_STYLES[r.scheme];
      expect([line.borderColor, line.borderDash, line.pointStyle]).toEqual([style.color, style.dash, style.marker]);
      // Its markers: a sparse point-only dataset on the curve, in the scheme's marker style.
      const markers = s.markers[k]!;
      expect([markers.scheme, markers.kind, markers.showLine, markers.pointStyle]).toEqual([r.scheme, 'marker', false, style.marker]);
      expect(markers.data.length).toBeGreaterThanOrEqual(4);
      expect(markers.data.length).toBeLessThanOrEqual(6);
      for (const p of markers.data) expect(line.data).toContainEqual(p);
      const rating = s.references.find((d) => d.scheme === r.scheme);
      if (r.switchRatingV === null) {
        // No switch in the library takes the stress (the resonant reset on the 380 V bus, whose leakage energy lifts
        // the resonance past 1.5 kV): no rating line, and the legend says so.
        expect(rating).toBeUndefined();
        expect(s.legend[k]!.detail).toBe('no rating chosen');
        continue;
      }
      expect(rating?.data.map((p) => p.y)).toEqual([r.switchRatingV, r.switchRatingV]);
      expect(rating?.borderColor).toBe(style.color);
      expect(s.legend[k]!.detail).toBe(`rating ${formatVolts(r.switchRatingV)}`);
    }
    // Every curve and rating fits under the suggested top of the axis.
    const top = Math.max(...[...s.lines, ...s.references].flatMap((d) => d.data.map((p) => p.y)));
    expect(s.yMax).toBeGreaterThanOrEqual(top);
    expect(s.yMin).toBe(0);
  });

  test('duty series: the switch duty from sweepVin, limit lines at dutyLimit, duty at Vin,min/max as in the result', () => {
    const d = buildDutySeries(buildSweeps(c, demoPartsLibrary));
    for (const [k, r] of c.results.entries()) {
      const line = d.lines[k]!;
      expect(line.data[0]!.y).toBeCloseTo(r.duty.atVinMin, 12);
      expect(line.data.at(-1)!.y).toBeCloseTo(r.duty.atVinMax, 12);
      expect(d.references[k]!.data.map((p) => p.y)).toEqual([r.dutyLimit, r.dutyLimit]);
      // The duty falls across the range from its value at Vin,min (which the engine holds to the limit; tests/unit/engine/properties.test.ts).
      expect(line.data.every((p) => p.y <= r.duty.atVinMin + 1e-12)).toBe(true);
    }
    expect(d.yMax).toBeLessThanOrEqual(1);
    expect(d.yMax).toBeGreaterThanOrEqual(Math.max(...c.results.map((r) => r.dutyLimit)));
  });

  test('the curves are designed with the library the comparison was evaluated against, not the demo library', () => {
    // Cores with twice the mean turn length: the leakage estimated from the build doubles, and with it the leakage share of the duty.
    const library = { ...demoPartsLibrary, cores: demoPartsLibrary.cores.map((core) => ({ ...core, mltM: 2 * core.mltM })) };
    const own = evaluate(c.input, library);
    const d = buildDutySeries(buildSweeps(own, library));
    for (const [k, r] of own.results.entries()) {
      expect(d.lines[k]!.data[0]!.y).toBeCloseTo(r.duty.atVinMin, 12);
      expect(d.lines[k]!.data.at(-1)!.y).toBeCloseTo(r.duty.atVinMax, 12);
    }
    // The demo library would draw other designs: the check above can tell them apart.
    const demo = buildDutySeries(buildSweeps(own, demoPartsLibrary));
    expect(own.results.some((r, k) => Math.abs(demo.lines[k]!.data.at(-1)!.y - r.duty.atVinMax) > 1e-6)).toBe(true);
  });

  test('loss stacks: one dataset per category, each scheme stack sums to lossesW.total', () => {
    const l = buildLossStacks(c);
    expect(l.datasets.map((d) => d.key)).toEqual(LOSS_CATEGORIES.map((x) => x.key));
    expect(l.labels).toHaveLength(c.results.length);
    for (const [j, r] of c.results.entries()) {
      const sum = l.datasets.reduce((acc, d) => acc + d.data[j]!, 0);
      expect(Math.abs(sum - r.lossesW.total)).toBeLessThan(1e-9);
      expect(l.totals[j]).toBe(sum);
      expect(l.labels[j]![0]).toBe(r.label);
      expect(l.labels[j]!.length).toBe(r.feasible ? 1 : 2);
    }
    expect(new Set(l.datasets.map((d) => d.backgroundColor)).size).toBe(l.datasets.length);
  });

  test('cost stacks: every BOM line lands in one group, stacks sum to bomCost within its rounding', () => {
    const cost = buildCostStacks(c);
    expect(cost.currency).toBe(c.results[0]!.currency);
    expect(cost.datasets.some((d) => d.key === 'other')).toBe(false);
    for (const [j, r] of c.results.entries()) {
      const sum = cost.datasets.reduce((acc, d) => acc + d.data[j]!, 0);
      expect(Math.abs(sum - r.bomCost)).toBeLessThanOrEqual(0.0005 + 1e-9);
      const grouped = Object.values(cost.lines).reduce((n, perScheme) => n + perScheme[j]!.length, 0);
      expect(grouped).toBe(r.parts.length);
    }
  });

  test('waveforms: four panels from the engine, time in µs over two periods', () => {
    for (const r of c.results) {
      const w = buildWaveSeries(c, r.scheme, demoPartsLibrary);
      const engine = waveforms(c.input, r.scheme);
      expect(w.periodUs).toBeCloseTo(1e6 / c.input.fswHz, 9);
      expect(w.drain.lines[0]!.data.map((p) => p.y)).toEqual(engine.drainV.map((p) => p.value));
      expect(w.drain.lines[0]!.data.at(-1)!.x).toBeCloseTo(2 * w.periodUs, 9);
      expect(w.currents.lines.map((d) => d.label)).toEqual(['Primary current', 'Magnetizing current']);
      expect(w.currents.lines[1]!.data.map((p) => p.y)).toEqual(engine.magnetizingA.map((p) => p.value));
      expect(w.secondary.lines[0]!.data.map((p) => p.y)).toEqual(engine.secondaryV.map((p) => p.value));
      expect(w.inductor.lines[0]!.data.map((p) => p.y)).toEqual(engine.inductorA.map((p) => p.value));
      expect(w.drain.references[0]!.data[0]!.y).toBe(c.input.vinNomV);
      for (const panel of [w.drain, w.currents, w.secondary, w.inductor]) {
        const ys = panel.lines.flatMap((d) => d.data.map((p) => p.y));
        expect(panel.yMin).toBeLessThanOrEqual(Math.min(...ys));
        expect(panel.yMax).toBeGreaterThanOrEqual(Math.max(...ys));
      }
      // Magnetizing current on its own right axis, zero level with the primary current's zero.
      expect(w.currents.lines[1]!.yAxisID).toBe('y2');
      const y2 = w.currents.y2!;
      const im = engine.magnetizingA.map((p) => p.value);
      expect(y2.min).toBeLessThanOrEqual(Math.min(...im));
      expect(y2.max).toBeGreaterThanOrEqual(Math.max(...im));
      expect(y2.min / y2.max).toBeCloseTo(w.currents.yMin / w.currents.yMax, 9);
      // The secondary swings both ways: its axis is centred on zero.
      expect(w.secondary.yMin).toBeCloseTo(-w.secondary.yMax, 9);
    }
  });

});

describe('helpers', () => {
  test('markers: every 8th point, each scheme in its own slot', () => {
    expect(markerRadii(17, 0).map((r) => r > 0)).toEqual([...Array(17)].map((_, i) => i % 8 === 0));
    expect(markerRadii(10, 2).flatMap((r, i) => (r > 0 ? [i] : []))).toEqual([2]);
    expect(new Set([0, 1, 2, 3, 4].map(markerSlot)).size).toBe(5);
  });

  test('waveform markers sit on corners, not along sampled arcs', () => {
    const square = [{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 1, y: 5 }, { x: 2, y: 5 }, { x: 2, y: 5 }, { x: 2, y: 0 }, { x: 3, y: 0 }];
    expect(cornerRadii(square).map((r) => r > 0)).toEqual([true, true, true, true, false, true, true]);
    const arc = [...Array(25)].map((_, i) => ({ x: i / 24, y: Math.sin((Math.PI * i) / 24) }));
    const marked = cornerRadii([{ x: -1, y: 0 }, ...arc.map((p) => ({ x: p.x, y: p.y }))]).filter((r) => r > 0).length;
    expect(marked).toBeLessThanOrEqual(4);
  });

  test('cost groups of the engine roles', () => {
    expect(costGroupOf('main-switch')).toBe('switches');
    expect(costGroupOf('clamp-switch')).toBe('switches');
    expect(costGroupOf('high-side-gate-driver')).toBe('drivers');
    expect(costGroupOf('sync-rectifier-driver')).toBe('drivers');
    expect(costGroupOf('freewheel-sync-rectifier')).toBe('rectifiers');
    expect(costGroupOf('resonant-capacitor')).toBe('reset');
    expect(costGroupOf('reset-diode')).toBe('reset');
    expect(costGroupOf('snubber-resistor')).toBe('reset');
    expect(costGroupOf('output-capacitor')).toBe('filter');
    expect(costGroupOf('transformer-core')).toBe('core');
    expect(costGroupOf('heatsink')).toBe('other');
  });

  test('stack colours get lighter step by step and are all different', () => {
    const lightness = (hex: string) => {
      const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255);
      return 0.2126 * r! + 0.7152 * g! + 0.0722 * b!;
    };
    for (const n of [2, 5, 6, 7]) {
      const ls = stackColours(n).map(lightness);
      expect(new Set(stackColours(n)).size).toBe(n);
      for (let i = 1; i < n; i++) expect(ls[i]! - ls[i - 1]!).toBeGreaterThan(0.05);
    }
  });

  test('number formats carry units and the agreed precision', () => {
    expect(formatVolts(45.6123)).toBe('45.6 V');
    // One voltage format on cards and charts alike (issue 18: a card said "1073 V" where the chart said "1.07 kV").
    expect(formatVolts(1073.2)).toBe('1073 V');
    expect(formatVolts(12_400)).toBe('12.4 kV');
    expect(formatDuty(0.375)).toBe('37.5 %');
    expect(formatWatts(4.16589)).toBe('4.17 W');
    expect(formatMoney(4.702, 'EUR')).toBe('4.70 EUR');
    expect(formatMoney(0.713, 'EUR', 3)).toBe('0.713 EUR');
    // One money format for Compare, briefs and mail: thousands grouped.
    expect(formatMoney(12345.6, 'EUR')).toBe('12,345.60 EUR');
  });
});
