import { useMemo } from 'react';
import { Line } from 'react-chartjs-2';
import { lineOptions, type LineAxes } from './options';
import type { LineSeries } from './types';

/** A Chart.js line chart of a prepared series (curves first, so index tooltips pick a curve's sample). */
export function LineChartBox({ series, axes, ariaLabel }: { series: LineSeries; axes: LineAxes; ariaLabel: string }) {
  const data = useMemo(() => ({ datasets: [...series.lines, ...series.markers, ...series.references] }), [series]);
  const options = useMemo(() => lineOptions(series, axes), [series, axes]);
  return <Line data={data} options={options} role="img" aria-label={ariaLabel} />;
}
