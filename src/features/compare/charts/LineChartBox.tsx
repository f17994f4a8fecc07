import { useLayoutEffect, useMemo, useRef } from 'react';
import { Line } from 'react-chartjs-2';
import { drawnReporter } from './drawn';
import { warmUpdates } from './warm';
import { lineOptions, type LineAxes } from './options';
import { overlayPlugin } from './overlays';
import type { LineSeries } from './types';

/**
 * A Chart.js line chart of a prepared series: the curves are datasets (curves first, so index
 * tooltips pick a curve's sample); reference lines and markers are drawn by `overlayPlugin`.
 * Chart.js updates only when `series` or `axes` change identity (see `useStable`).
 */
export function LineChartBox({ series, axes, ariaLabel, name }: { series: LineSeries; axes: LineAxes; ariaLabel: string; name: string }) {
  const latest = useRef(series);
  // Layout effects run before react-chartjs-2's update effect, so the overlays drawn are this series'.
  useLayoutEffect(() => {
    latest.current = series;
  }, [series]);
  const plugins = useMemo(() => [overlayPlugin(() => latest.current), drawnReporter(name), warmUpdates()], [name]);
  const data = useMemo(() => ({ datasets: series.lines }), [series]);
  const options = useMemo(() => lineOptions(series, axes), [series, axes]);
  return <Line data={data} options={options} plugins={plugins} role="img" aria-label={ariaLabel} />;
}
