import '../../../components/charts/register';
import { useMemo } from 'react';
import { Bar } from 'react-chartjs-2';
import type { Comparison } from '../../../engine/index';
import { ChartCard } from './ChartCard';
import { formatDuty, formatMoney, formatVolts, formatWatts } from './format';
import { LineChartBox } from './LineChartBox';
import { stackedBarOptions, stackTotalsPlugin, type LineAxes } from './options';
import { buildCostStacks, buildLossStacks } from './stacks';
import { installPrintSharpness } from './print-sharpness';
import { LineLegend } from './Swatch';
import { buildDutySeries, buildStressSeries, buildSweeps } from './sweep-series';
import { WaveformCard } from './WaveformCard';

interface Props {
  comparison: Comparison;
}

const vinTick = (x: number) => String(Number(x.toPrecision(4)));
const vinTitle = (x: number) => `Vin = ${formatVolts(x)}`;
const lossTotals = [stackTotalsPlugin(formatWatts)];
installPrintSharpness();

/**
 * The Compare screen's charts: switch voltage and duty across the input range, loss and BOM cost
 * breakdowns, and idealised waveforms per scheme. Everything is rebuilt from `comparison` only
 * (memoised), with animation off, so it keeps up with live edits.
 */
export default function CompareCharts({ comparison }: Props) {
  const built = useMemo(() => {
    try {
      const sweeps = buildSweeps(comparison);
      return { stress: buildStressSeries(comparison, sweeps), duty: buildDutySeries(comparison, sweeps), loss: buildLossStacks(comparison), cost: buildCostStacks(comparison) };
    } catch (error) {
      return error instanceof Error ? error : new Error(String(error));
    }
  }, [comparison]);

  const axes = useMemo(() => {
    const byScheme = new Map(comparison.results.map((r) => [r.scheme, r]));
    const stress: LineAxes = {
      xTitle: 'Input voltage (V)', yTitle: 'Switch peak voltage (V)', xTick: vinTick, yTick: (y) => String(y), tooltipTitle: vinTitle,
      tooltipLabel: (d, y) => {
        const rating = d.scheme ? byScheme.get(d.scheme)?.switchRatingV : null;
        return `${d.label}: ${formatVolts(y)}${rating ? ` (rated ${formatVolts(rating)})` : ''}`;
      },
    };
    const duty: LineAxes = {
      xTitle: 'Input voltage (V)', yTitle: 'Duty (%)', xTick: vinTick, yTick: (y) => `${Math.round(y * 100)}`, tooltipTitle: vinTitle, exactY: true,
      tooltipLabel: (d, y) => {
        const limit = d.scheme ? byScheme.get(d.scheme)?.dutyLimit : undefined;
        return `${d.label}: ${formatDuty(y)}${limit !== undefined ? ` (limit ${formatDuty(limit)})` : ''}`;
      },
    };
    return { stress, duty };
  }, [comparison]);

  const barOptions = useMemo(() => {
    if (built instanceof Error) return null;
    const { loss, cost } = built;
    const money = (v: number) => formatMoney(v, cost.currency);
    const costLines = (item: { dataIndex: number; dataset: { label?: string } }) => {
      const group = cost.datasets.find((d) => d.label === item.dataset.label)?.key;
      const lines = group ? (cost.lines[group]?.[item.dataIndex] ?? []) : [];
      return lines.map((l) => `  ${l.qty} × ${l.role} ${l.partId} @ ${formatMoney(l.unitPrice, cost.currency, 3)}`);
    };
    return {
      loss: stackedBarOptions('Loss (W)', formatWatts, (v) => String(v), (i) => `Total ${formatWatts(loss.totals[i] ?? NaN)}`),
      cost: stackedBarOptions(`BOM cost (${cost.currency})`, money, (v) => String(v), (i) => `Total ${money(cost.totals[i] ?? NaN)}`, costLines),
      costTotals: [stackTotalsPlugin(money)],
    };
  }, [built]);

  if (comparison.results.length === 0) return <p className="text-sm text-muted">No scheme was evaluated, so there is nothing to chart.</p>;
  if (built instanceof Error || !barOptions) {
    return <p className="text-sm text-fail">The charts could not be drawn for this specification: {built instanceof Error ? built.message : ''}</p>;
  }

  const { stress, duty, loss, cost } = built;
  const spec = comparison.input;
  const range = `Vin ${formatVolts(spec.vinMinV)} to ${formatVolts(spec.vinMaxV)}`;
  return (
    <div className="grid grid-cols-1 gap-4 lg:grid-cols-2">
      <ChartCard
        name="switch-stress"
        title="Switch voltage across the input range"
        caption={`Main switch off-state voltage, steady state over ${range} (leakage spike and high-line transient not shown); thin dotted line: chosen voltage rating.`}
        chart={<LineChartBox series={stress} axes={axes.stress} ariaLabel={`Switch peak voltage against input voltage for ${comparison.results.length} schemes`} />}
      >
        <LineLegend entries={stress.legend} />
      </ChartCard>
      <ChartCard
        name="duty"
        title="Duty across the input range"
        caption={`Duty in regulation, D = K / Vin, over ${range}; thin dotted line: the scheme's duty limit (reset or controller).`}
        chart={<LineChartBox series={duty} axes={axes.duty} ariaLabel={`Duty against input voltage for ${comparison.results.length} schemes`} />}
      >
        <LineLegend entries={duty.legend} />
      </ChartCard>
      <ChartCard
        name="losses"
        title="Loss breakdown"
        caption={`Power-stage losses at Vin,nom = ${formatVolts(spec.vinNomV)}, full load, steady state; total above each bar.`}
        height={280}
        chart={<Bar data={loss} options={barOptions.loss} plugins={lossTotals} role="img" aria-label="Loss breakdown per scheme in watts" />}
      />
      <ChartCard
        name="cost"
        title="BOM cost breakdown"
        caption={`Power-stage parts at ${spec.annualVolume.toLocaleString('en')} pcs/year from ${comparison.partsLibrary.name}; total above each bar, in ${cost.currency}.`}
        height={280}
        chart={<Bar data={cost} options={barOptions.cost} plugins={barOptions.costTotals} role="img" aria-label={`BOM cost breakdown per scheme in ${cost.currency}`} />}
      />
      <WaveformCard comparison={comparison} />
    </div>
  );
}
