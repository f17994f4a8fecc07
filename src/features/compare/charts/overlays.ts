import type { Chart, Plugin } from 'chart.js';
import { drawPoint } from 'chart.js/helpers';
import type { LineDataset, LineSeries } from './types';

/** Border width of point markers (the line charts' `elements.point.borderWidth`). */
export const MARKER_BORDER_W = 1.5;

const CLIP_MARGIN = 4;

const radiusAt = (radius: LineDataset['pointRadius'], i: number): number =>
  typeof radius === 'number' ? radius : Array.isArray(radius) ? Number(radius[i] ?? 0) : 0;

function strokeReference(chart: Chart, d: LineDataset): void {
  const x = chart.scales.x;
  const y = chart.scales[d.yAxisID ?? 'y'];
  const [a, b] = d.data;
  if (!x || !y || !a || !b) return;
  const { ctx } = chart;
  ctx.save();
  ctx.lineCap = 'butt';
  ctx.lineJoin = 'miter';
  ctx.setLineDash((d.borderDash as number[] | undefined) ?? []);
  ctx.lineWidth = Number(d.borderWidth ?? 1);
  ctx.strokeStyle = String(d.borderColor);
  ctx.beginPath();
  ctx.moveTo(x.getPixelForValue(a.x), y.getPixelForValue(a.y));
  ctx.lineTo(x.getPixelForValue(b.x), y.getPixelForValue(b.y));
  ctx.stroke();
  ctx.restore();
}

function drawMarkers(chart: Chart, d: LineDataset, fill: string, borderWidth: number): void {
  const x = chart.scales.x;
  const y = chart.scales[d.yAxisID ?? 'y'];
  if (!x || !y || !d.pointStyle) return;
  const { ctx, chartArea: area } = chart;
  ctx.save();
  ctx.setLineDash([]);
  ctx.strokeStyle = String(d.pointBorderColor ?? d.borderColor);
  ctx.fillStyle = fill;
  ctx.lineWidth = borderWidth;
  d.data.forEach((p, i) => {
    const radius = radiusAt(d.pointRadius, i);
    if (radius < 0.1) return;
    const px = x.getPixelForValue(p.x);
    const py = y.getPixelForValue(p.y);
    // Like Chart.js's own points: skip markers centred outside the plot area by more than their size.
    const margin = radius + borderWidth;
    if (px < area.left - margin || px > area.right + margin || py < area.top - margin || py > area.bottom + margin) return;
    drawPoint(ctx, { pointStyle: d.pointStyle as never, rotation: 0, radius, borderWidth }, px, py);
  });
  ctx.restore();
}

/**
 * Draws a line series' reference lines (ratings, limits, Vin) and its sparse curve markers
 * straight onto the canvas, under the curves, instead of as Chart.js datasets: they carry no
 * tooltips and no hover, and each dataset costs option resolution and element updates on every
 * live edit. `current` is read at draw time, so the chart's latest series is always the one drawn.
 */
export function overlayPlugin(current: () => LineSeries): Plugin<'line'> {
  return {
    id: 'resetwiseOverlays',
    beforeDatasetsDraw(chart) {
      const { references, markers } = current();
      const { ctx, chartArea: area } = chart;
      ctx.save();
      ctx.beginPath();
      // The plot area plus a few pixels, as Chart.js clips a dataset (a line on the axis keeps its width).
      ctx.rect(area.left - CLIP_MARGIN, area.top - CLIP_MARGIN, area.right - area.left + 2 * CLIP_MARGIN, area.bottom - area.top + 2 * CLIP_MARGIN);
      ctx.clip();
      for (const d of references) strokeReference(chart, d);
      ctx.restore();
      for (const d of references) drawMarkers(chart, d, String(d.pointBackgroundColor ?? '#ffffff'), MARKER_BORDER_W);
      for (let i = markers.length - 1; i >= 0; i--) {
        const d = markers[i]!;
        drawMarkers(chart, d, String(d.pointBackgroundColor ?? d.borderColor), Number(d.pointBorderWidth ?? MARKER_BORDER_W));
      }
    },
  };
}
