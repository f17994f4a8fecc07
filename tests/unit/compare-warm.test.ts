import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Chart } from 'chart.js';
import { drawnReporter } from '../../src/features/compare/charts/drawn';
import { warmUpdates } from '../../src/features/compare/charts/warm';
import { markEdit } from '../../src/lib/perf';

/** A stand-in for a Chart.js chart: the plugins' hooks run around each update, as Chart.js runs them. */
function fakeChart(plugins: ReturnType<typeof warmUpdates>[]) {
  const chart = {
    canvas: { isConnected: true },
    config: { options: { responsive: true } },
    options: {} as object,
    updates: [] as object[],
    update(this: { options: object; updates: object[] }) {
      this.updates.push(this.options);
      for (const p of plugins) p.afterUpdate?.(chart as unknown as Chart, { mode: 'none' }, {});
      for (const p of plugins) p.afterRender?.(chart as unknown as Chart, {}, {});
    },
  };
  return chart;
}

describe('idle warm-up of chart updates', () => {
  afterEach(() => vi.unstubAllGlobals());

  it('redraws a chart the given number of times while idle, each with a fresh copy of its options, and never as an edit', () => {
    const idle: (() => void)[] = [];
    vi.stubGlobal('window', { requestIdleCallback: (step: () => void) => idle.push(step), __resetwiseUpdates: [] });
    vi.stubGlobal('performance', { now: () => 1000 });
    markEdit();
    const warm = warmUpdates(3);
    const chart = fakeChart([drawnReporter('stress'), warm]);
    warm.afterInit?.(chart as unknown as Chart, {}, {});
    while (idle.length > 0) idle.shift()!();
    expect(chart.updates).toHaveLength(3);
    for (const options of chart.updates) {
      expect(options).toEqual(chart.config.options);
      expect(options).not.toBe(chart.config.options);
    }
    // The edit timing saw none of them; a real update afterwards is reported.
    const w = globalThis.window as unknown as { __resetwiseUpdates: { island: string }[] };
    expect(w.__resetwiseUpdates).toEqual([]);
    chart.update();
    expect(w.__resetwiseUpdates.map((u) => u.island)).toEqual(['chart:stress']);
  });

  it('stops once the chart has left the page', () => {
    const idle: (() => void)[] = [];
    vi.stubGlobal('window', { requestIdleCallback: (step: () => void) => idle.push(step) });
    const warm = warmUpdates(3);
    const chart = fakeChart([warm]);
    warm.afterInit?.(chart as unknown as Chart, {}, {});
    chart.canvas.isConnected = false;
    while (idle.length > 0) idle.shift()!();
    expect(chart.updates).toHaveLength(0);
  });
});
