import type { LineDataset } from './types';

/**
 * The markers of a curve as a separate, point-only dataset holding just the marked samples.
 * Per-point radius arrays make Chart.js resolve options point by point on every update; a
 * sparse marker dataset with plain options keeps live updates cheap.
 */
export function markerDataset(line: LineDataset, radii: number[]): LineDataset {
  const radius = Math.max(0, ...radii);
  return {
    type: 'line', scheme: line.scheme, kind: 'marker', label: `${String(line.label)} · markers`,
    data: line.data.filter((_, i) => (radii[i] ?? 0) > 0), showLine: false,
    pointStyle: line.pointStyle, pointRadius: radius, pointHoverRadius: radius, pointHitRadius: 0,
    pointBackgroundColor: line.borderColor as string, pointBorderColor: line.borderColor as string, pointBorderWidth: 1.5,
    borderColor: line.borderColor, backgroundColor: line.borderColor as string, order: line.order,
  };
}
