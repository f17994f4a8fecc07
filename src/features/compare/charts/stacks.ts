import type { ChartDataset } from 'chart.js';
import type { BomLine, Comparison, LossesW, SchemeResult } from '../../../engine/index';
import { stackColours } from './palette';

/** One stacked bar chart: schemes along x, one dataset per category. */
export interface StackSeries {
  /** x category labels, one per scheme (two lines when the scheme is not feasible). */
  labels: string[][];
  datasets: (ChartDataset<'bar', number[]> & { key: string })[];
  /** Sum of the stack per scheme. */
  totals: number[];
}

/** Loss categories in stack order (bottom first), with legend names. */
export const LOSS_CATEGORIES: readonly { key: Exclude<keyof LossesW, 'total'>; label: string }[] = [
  { key: 'switchConduction', label: 'Switch conduction' },
  { key: 'switching', label: 'Switching' },
  { key: 'gateDrive', label: 'Gate drive' },
  { key: 'resetOrClamp', label: 'Reset / clamp' },
  { key: 'rectifiers', label: 'Rectifiers' },
  { key: 'transformer', label: 'Transformer' },
  { key: 'inductor', label: 'Output inductor' },
];

/** Cost groups in stack order, each gathering BOM roles that do the same job. */
export const COST_GROUPS: readonly { key: string; label: string }[] = [
  { key: 'switches', label: 'Power switches' },
  { key: 'drivers', label: 'Gate drivers' },
  { key: 'reset', label: 'Reset / clamp / snubber' },
  { key: 'core', label: 'Transformer (core and windings)' },
  { key: 'rectifiers', label: 'Output rectifiers' },
  { key: 'filter', label: 'Output filter' },
  { key: 'other', label: 'Other' },
];

/** Cost group of a BOM role ('other' for roles this chart does not know yet). */
export function costGroupOf(role: string): string {
  if (role === 'main-switch' || role === 'clamp-switch') return 'switches';
  if (role.endsWith('driver')) return 'drivers';
  if (role.startsWith('transformer-')) return 'core';
  if (role.endsWith('rectifier')) return 'rectifiers';
  if (role.startsWith('output-')) return 'filter';
  if (/^(reset|clamp|snubber|resonant)-/.test(role)) return 'reset';
  return 'other';
}

function categoryLabels(results: SchemeResult[]): string[][] {
  return results.map((r) => (r.feasible ? [r.label] : [r.label, '(not feasible)']));
}

const BAR_STYLE = { borderColor: '#ffffff', borderWidth: { top: 1, right: 0, bottom: 0, left: 0 }, maxBarThickness: 56, categoryPercentage: 0.7, barPercentage: 0.9 } as const;

/** Loss breakdown (W) at Vin,nom, full load: one dataset per loss category, stacked per scheme. */
export function buildLossStacks(comparison: Comparison): StackSeries {
  const results = comparison.results;
  const colours = stackColours(LOSS_CATEGORIES.length);
  const datasets = LOSS_CATEGORIES.map((c, i) => ({
    key: c.key, label: c.label, data: results.map((r) => r.lossesW[c.key]), backgroundColor: colours[i], stack: 'loss', ...BAR_STYLE,
  }));
  const totals = results.map((_, j) => datasets.reduce((sum, d) => sum + (d.data[j] ?? 0), 0));
  return { labels: categoryLabels(results), datasets, totals };
}

/** BOM lines per cost group and scheme (for tooltips): lines[groupKey][schemeIndex]. */
export type CostLines = Record<string, BomLine[][]>;

/**
 * BOM cost breakdown: qty·unitPrice summed per cost group, stacked per scheme. Groups with no
 * cost in any scheme are left out (so "Other" only shows when an unknown role appears).
 */
export function buildCostStacks(comparison: Comparison): StackSeries & { lines: CostLines; currency: string } {
  const results = comparison.results;
  const lines: CostLines = {};
  for (const g of COST_GROUPS) lines[g.key] = results.map(() => []);
  results.forEach((r, j) => {
    for (const line of r.parts) lines[costGroupOf(line.role)]![j]!.push(line);
  });
  const used = COST_GROUPS.filter((g) => lines[g.key]!.some((ls) => ls.length > 0));
  const colours = stackColours(used.length);
  const datasets = used.map((g, i) => ({
    key: g.key, label: g.label, backgroundColor: colours[i], stack: 'cost', ...BAR_STYLE,
    data: lines[g.key]!.map((ls) => ls.reduce((sum, l) => sum + l.qty * l.unitPrice, 0)),
  }));
  const totals = results.map((_, j) => datasets.reduce((sum, d) => sum + (d.data[j] ?? 0), 0));
  const currency = results[0]?.currency ?? comparison.partsLibrary.currency;
  return { labels: categoryLabels(results), datasets, totals, lines, currency };
}
