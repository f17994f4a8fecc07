import type { BarElement, ChartOptions, Plugin, TooltipItem } from 'chart.js';
import { INK } from './palette';
import type { LineDataset, LineSeries } from './types';

/** Axis and tooltip wording of one line chart. */
export interface LineAxes {
  xTitle: string;
  yTitle: string;
  xTick: (x: number) => string;
  yTick: (y: number) => string;
  /** Tooltip heading from the hovered x value. */
  tooltipTitle: (x: number) => string;
  /** Tooltip row of one curve at the hovered point. */
  tooltipLabel: (dataset: LineDataset, y: number) => string;
  /** Fix the y range to the series' yMin/yMax (otherwise they are suggestions). */
  exactY?: boolean;
  /** Label only round x ticks, not the range ends (time axes ending at 2T). */
  xRoundOnly?: boolean;
}

const FAST = { animation: false, responsive: true, maintainAspectRatio: false } as const;

/**
 * A plugin switched off for a chart (`false` in its options), not merely hidden: a hidden legend or
 * title still takes part in every layout pass and plugin call of every update. Chart.js documents
 * `false` here; its option types do not list it.
 */
const OFF = false as unknown as Record<string, never>;

/**
 * Options for a line chart on linear x and y axes. Data points are pre-built {x, y} objects, so
 * parsing is off; only 'value' curves get tooltips (reference lines are explained in the legend).
 */
export function lineOptions(s: LineSeries, a: LineAxes): ChartOptions<'line'> {
  return {
    ...FAST,
    parsing: false,
    normalized: true,
    interaction: { mode: 'index', intersect: false, axis: 'x' },
    layout: { padding: { right: 8 } },
    elements: { point: { borderWidth: 1.5 } },
    plugins: {
      legend: OFF, // the legend is drawn in HTML above the chart
      title: OFF,
      tooltip: {
        filter: (item: TooltipItem<'line'>) => (item.dataset as LineDataset).kind === 'value',
        callbacks: {
          title: (items) => (items[0] ? a.tooltipTitle(items[0].parsed.x ?? 0) : ''),
          label: (item) => a.tooltipLabel(item.dataset as LineDataset, item.parsed.y ?? 0),
        },
      },
    },
    scales: {
      x: {
        type: 'linear', min: s.xMin, max: s.xMax,
        title: { display: true, text: a.xTitle, color: INK },
        ticks: { callback: (v) => a.xTick(Number(v)), maxRotation: 0, autoSkipPadding: 10, includeBounds: !a.xRoundOnly },
      },
      y: {
        type: 'linear',
        ...(a.exactY ? { min: s.yMin, max: s.yMax } : { suggestedMin: s.yMin, suggestedMax: s.yMax }),
        title: { display: true, text: a.yTitle, color: INK },
        // Exact ranges end at odd values: label only the round ticks inside.
        ticks: { callback: (v) => a.yTick(Number(v)), includeBounds: !a.exactY },
      },
      ...(s.y2
        ? {
            y2: {
              type: 'linear' as const, position: 'right' as const, min: s.y2.min, max: s.y2.max,
              title: { display: true, text: s.y2.title, color: INK },
              grid: { drawOnChartArea: false },
              ticks: { callback: (v: string | number) => a.yTick(Number(v)), includeBounds: false },
            },
          }
        : {}),
    },
  };
}

/** Options for a stacked bar chart (schemes on x, categories stacked), legend below with each category named. */
export function stackedBarOptions(yTitle: string, value: (v: number) => string, axisTick: (v: number) => string, footer: (index: number) => string, afterLabel?: (item: TooltipItem<'bar'>) => string[]): ChartOptions<'bar'> {
  return {
    ...FAST,
    layout: { padding: { top: 18 } },
    interaction: { mode: 'nearest', intersect: true },
    plugins: {
      legend: { position: 'bottom', reverse: false, labels: { boxWidth: 12, boxHeight: 12, padding: 10, color: INK } },
      title: OFF,
      tooltip: {
        callbacks: {
          label: (item) => `${item.dataset.label ?? ''}: ${value(Number(item.raw))}`,
          ...(afterLabel ? { afterLabel } : {}),
          footer: (items) => (items[0] ? footer(items[0].dataIndex) : ''),
        },
      },
    },
    scales: {
      x: { type: 'category', stacked: true, grid: { display: false }, ticks: { color: INK, maxRotation: 0, autoSkip: false } },
      y: { type: 'linear', stacked: true, beginAtZero: true, grace: '8%', title: { display: true, text: yTitle, color: INK }, ticks: { callback: (v) => axisTick(Number(v)) } },
    },
  };
}

/** Writes each stack's total above its bar (reads in print without tooltips). */
export function stackTotalsPlugin(format: (v: number) => string): Plugin<'bar'> {
  return {
    id: 'resetwiseStackTotals',
    afterDatasetsDraw(chart) {
      const metas = chart.getSortedVisibleDatasetMetas();
      const count = chart.data.labels?.length ?? 0;
      const { ctx } = chart;
      ctx.save();
      ctx.font = `600 11px ${String(chart.options.font?.family ?? 'sans-serif')}`;
      ctx.fillStyle = INK;
      ctx.textAlign = 'center';
      ctx.textBaseline = 'bottom';
      for (let j = 0; j < count; j++) {
        let total = 0;
        let top = Infinity;
        let x = NaN;
        for (const meta of metas) {
          const v = chart.data.datasets[meta.index]?.data[j];
          if (typeof v === 'number' && Number.isFinite(v)) total += v;
          const bar = meta.data[j] as BarElement | undefined;
          if (bar) {
            top = Math.min(top, bar.y);
            x = bar.x;
          }
        }
        if (Number.isFinite(top) && Number.isFinite(x)) ctx.fillText(format(total), x, top - 3);
      }
      ctx.restore();
    },
  };
}
