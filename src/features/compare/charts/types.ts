import type { ChartDataset } from 'chart.js';
import type { SchemeId } from '../../../engine/index';
import type { SchemeStyle } from '../../../lib/scheme-style';

/** One point of a line chart with a numeric (linear) x axis. */
export interface XY {
  x: number;
  y: number;
}

/** A line dataset plus what it stands for (used by tooltips and the legend). */
export type LineDataset = ChartDataset<'line', XY[]> & {
  /** The scheme the line belongs to, or null for a reference line that is not a scheme's. */
  scheme: SchemeId | null;
  /**
   * 'value': a computed curve; 'marker': the sparse point markers of a curve (drawn as their own
   * dataset so the curve's options stay shared and cheap to update); 'limit': a horizontal
   * reference (rating, duty limit, Vin).
   */
  kind: 'value' | 'marker' | 'limit';
};

/** A legend row drawn in HTML (line swatch with dash and marker, so it reads in greyscale). */
export interface LegendEntry {
  key: string;
  label: string;
  /** Short figure shown after the label, e.g. "rating 100 V". */
  detail?: string;
  color: string;
  dash: number[];
  marker: SchemeStyle['marker'] | 'none';
  /** Thin reference line rather than a data curve. */
  thin?: boolean;
}

/** A line chart's data and legend. */
export interface LineSeries {
  /** One curve per scheme (or per quantity for waveforms). */
  lines: LineDataset[];
  /** Marker-only datasets, one per curve that shows markers. */
  markers: LineDataset[];
  /** Reference lines (ratings, limits), drawn thin and left out of tooltips. */
  references: LineDataset[];
  legend: LegendEntry[];
  /** Suggested y range so every curve and reference line fits. */
  yMin: number;
  yMax: number;
  xMin: number;
  xMax: number;
  /** Range of a right-hand axis (datasets with yAxisID 'y2'), zero aligned with the left axis. */
  y2?: { min: number; max: number; title: string };
}
