import { useEffect, useMemo, useRef } from 'react';
import { Scatter } from 'react-chartjs-2';
import type { ChartData, ChartOptions, Chart as ChartType } from 'chart.js';
import '../../components/charts/register';
import { SCHEME_LABELS } from '../../engine/scheme-ids';
import { SCHEME_STYLES } from '../../lib/scheme-style';
import { formatSi } from '../../lib/si';
import type { SweepMessage } from './protocol';
import { pointAt, type DesignPoint } from './points';
import { F, STRIDE } from './run';

type Done = Extract<SweepMessage, { type: 'done' }>;
interface XY { x: number; y: number; i: number }

interface Props {
  result: Done;
  currency: string;
  onPick: (p: DesignPoint) => void;
  /** Called once the chart has painted. */
  onDrawn: () => void;
}

const alpha = (hex: string, a: number): string => `${hex}${Math.round(a * 255).toString(16).padStart(2, '0')}`;

/** BOM cost against total loss: a thinned cloud per scheme, each scheme's Pareto front, and the overall front on top. */
export default function SweepChart({ result, currency, onPick, onDrawn }: Props) {
  const chartRef = useRef<ChartType<'scatter', XY[]>>(null);
  const { plan, data } = result;
  const xy = (i: number): XY => ({ x: data[i * STRIDE + F.cost]!, y: data[i * STRIDE + F.lossW]!, i });
  const chartData = useMemo((): ChartData<'scatter', XY[]> => ({
    datasets: [
      {
        label: 'Overall Pareto front', data: result.overall.map(xy), showLine: true, borderColor: '#1e2622', backgroundColor: '#1e2622',
        borderWidth: 2.5, pointRadius: 4.5, pointHoverRadius: 7, pointStyle: 'crossRot', order: 0,
      },
      ...plan.schemes.map((scheme, s) => {
        const st = SCHEME_STYLES[scheme];
        return {
          label: `${SCHEME_LABELS[scheme]} front`, data: result.fronts[s]!.map(xy), showLine: true, borderColor: st.color, backgroundColor: st.color,
          borderDash: st.dash, borderWidth: 1.5, pointRadius: 3, pointHoverRadius: 6, pointStyle: st.marker, order: 1,
        };
      }),
      ...plan.schemes.map((scheme, s) => {
        const st = SCHEME_STYLES[scheme];
        return {
          label: `${SCHEME_LABELS[scheme]} points`, data: result.clouds[s]!.map(xy), borderColor: alpha(st.color, 0.35), backgroundColor: alpha(st.color, 0.2),
          pointRadius: 1.6, pointHoverRadius: 4, pointStyle: st.marker, borderWidth: 0.6, order: 2,
        };
      }),
    ],
  }), [result]);
  const options = useMemo((): ChartOptions<'scatter'> => ({
    animation: false, responsive: true, maintainAspectRatio: false, parsing: false, normalized: true,
    interaction: { mode: 'nearest', intersect: false, axis: 'xy' },
    scales: {
      x: { type: 'linear', title: { display: true, text: `Power-stage BOM cost (${currency} per unit)` } },
      y: { type: 'linear', title: { display: true, text: 'Total loss at Vin,nom, full load (W)' } },
    },
    plugins: {
      legend: { position: 'bottom', labels: { usePointStyle: true, boxWidth: 8, filter: (item) => !String(item.text).endsWith(' points') || false } },
      tooltip: {
        callbacks: {
          title: (items) => {
            const p = pointAt(plan, data, (items[0]!.raw as XY).i);
            return `${SCHEME_LABELS[p.scheme]} · ${formatSi(p.fswHz, 'Hz')}`;
          },
          label: (item) => {
            const p = pointAt(plan, data, (item.raw as XY).i);
            return [
              `BOM ${p.cost.toFixed(2)} ${currency} · loss ${formatSi(p.lossW, 'W')} · η ${(p.efficiency * 100).toFixed(1)} %`,
              `duty limit ${p.dutyLimit.toFixed(3)} · Ns/Np ${p.turnsRatio.toFixed(3)}`,
              `switch ${p.mainSwitch ?? 'auto'} · rectifier ${p.rectifier ?? 'auto'} · core ${p.core ?? 'auto'}`,
              'Click to open this point in Compare',
            ];
          },
        },
      },
    },
    onClick: (_event, elements) => {
      const hit = elements[0];
      if (!hit) return;
      const raw = chartRef.current?.data.datasets[hit.datasetIndex]?.data[hit.index];
      if (raw) onPick(pointAt(plan, data, raw.i));
    },
  }), [result, currency]);
  useEffect(() => {
    const id = requestAnimationFrame(() => onDrawn());
    return () => cancelAnimationFrame(id);
  }, [result]);
  return (
    <div className="h-[30rem]" data-sweep-chart>
      <Scatter ref={chartRef} data={chartData} options={options} aria-label="BOM cost against total loss for every feasible design point, with Pareto fronts" role="img" />
    </div>
  );
}
