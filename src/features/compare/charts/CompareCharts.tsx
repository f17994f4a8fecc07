import '../../../components/charts/register';
import { useMemo, useRef } from 'react';
import { Bar } from 'react-chartjs-2';
import type { Comparison, PartsLibrary } from '../../../engine/index';
import { ChartCard } from './ChartCard';
import { formatDuty, formatMoney, formatVolts, formatWatts } from '../../../lib/format';
import { LineChartBox } from './LineChartBox';
import { stackedBarOptions, stackTotalsPlugin, type LineAxes } from './options';
import { buildCostStacks, buildLossStacks } from './stacks';
import { installPrintSharpness } from './print-sharpness';
import { drawnReporter } from './drawn';
import { warmUpdates } from './warm';
import { useStable } from './stable';
import type { LineDataset } from './types';
import { LineLegend } from './Swatch';
import { buildDutySeries, buildStressSeries, buildSweeps } from './sweep-series';
import { WaveformCard } from './WaveformCard';

interface Props {
  comparison: Comparison;
  /** The parts library the comparison was evaluated against (the curves and waveforms redesign with it). */
  library: PartsLibrary;
}

const vinTick = (x: number) => String(Number(x.toPrecision(4)));
const vinTitle = (x: number) => `Vin = ${formatVolts(x)}`;
installPrintSharpness();

/**
 * The Compare screen's charts: switch voltage and duty across the input range, loss and BOM cost
 * breakdowns, and idealised waveforms per scheme. Everything is rebuilt from `comparison` only
 * (memoised), with animation off; a chart whose data an edit leaves unchanged is not updated.
 */
export default function CompareCharts({ comparison, library }: Props) {
  const built = useMemo(() => {
    try {
      const sweeps = buildSweeps(comparison, library);
      return { stress: buildStressSeries(sweeps), duty: buildDutySeries(sweeps), loss: buildLossStacks(comparison), cost: buildCostStacks(comparison) };
    } catch (error) {
      return error instanceof Error ? error : new Error(String(error));
    }
  }, [comparison, library]);
  const ok = built instanceof Error ? null : built;
  // Each chart keeps its data while an edit leaves it unchanged (a weight, Vin,nom for the sweeps…).
  const stress = useStable(ok?.stress ?? null);
  const duty = useStable(ok?.duty ?? null);
  const loss = useStable(ok?.loss ?? null);
  const cost = useStable(ok?.cost ?? null);

  // Tooltips look up ratings and limits when shown, so the axes (and options) stay put across edits.
  const latest = useRef(comparison);
  latest.current = comparison;
  const axes = useMemo(() => {
    const resultOf = (d: LineDataset) => (d.scheme ? latest.current.results.find((r) => r.scheme === d.scheme) : undefined);
    const stressAxes: LineAxes = {
      xTitle: 'Input voltage (V)', yTitle: 'Switch peak voltage (V)', xTick: vinTick, yTick: (y) => String(y), tooltipTitle: vinTitle,
      tooltipLabel: (d, y) => {
        const rating = resultOf(d)?.switchRatingV;
        return `${d.label}: ${formatVolts(y)}${rating ? ` (rated ${formatVolts(rating)})` : ''}`;
      },
    };
    const dutyAxes: LineAxes = {
      xTitle: 'Input voltage (V)', yTitle: 'Duty (%)', xTick: vinTick, yTick: (y) => `${Math.round(y * 100)}`, tooltipTitle: vinTitle, exactY: true,
      tooltipLabel: (d, y) => {
        const limit = resultOf(d)?.dutyLimit;
        return `${d.label}: ${formatDuty(y)}${limit !== undefined ? ` (limit ${formatDuty(limit)})` : ''}`;
      },
    };
    return { stress: stressAxes, duty: dutyAxes };
  }, []);

  const lossOptions = useMemo(
    () => loss && stackedBarOptions('Loss (W)', formatWatts, (v) => String(v), (i) => `Total ${formatWatts(loss.totals[i] ?? NaN)}`),
    [loss],
  );
  const costOptions = useMemo(() => {
    if (!cost) return null;
    const money = (v: number) => formatMoney(v, cost.currency);
    const costLines = (item: { dataIndex: number; dataset: { label?: string } }) => {
      const group = cost.datasets.find((d) => d.label === item.dataset.label)?.key;
      const lines = group ? (cost.lines[group]?.[item.dataIndex] ?? []) : [];
      return lines.map((l) => `  ${l.qty} × ${l.role} ${l.partId} @ ${formatMoney(l.unitPrice, cost.currency, 3)}`);
    };
    return stackedBarOptions(`BOM cost (${cost.currency})`, money, (v) => String(v), (i) => `Total ${money(cost.totals[i] ?? NaN)}`, costLines);
  }, [cost]);
  // Chart.js keeps the plugins it was created with: the totals read the current currency when drawn.
  const currency = useRef(cost?.currency ?? '');
  currency.current = cost?.currency ?? currency.current;
  const lossPlugins = useMemo(() => [stackTotalsPlugin(formatWatts), drawnReporter('losses'), warmUpdates()], []);
  const costPlugins = useMemo(() => [stackTotalsPlugin((v) => formatMoney(v, currency.current)), drawnReporter('cost'), warmUpdates()], []);

  if (comparison.results.length === 0) return <p className="text-sm text-muted">No scheme was evaluated, so there is nothing to chart.</p>;
  if (built instanceof Error || !stress || !duty || !loss || !cost || !lossOptions || !costOptions) {
    return <p className="text-sm text-fail">The charts could not be drawn for this specification: {built instanceof Error ? built.message : ''}</p>;
  }

  const spec = comparison.input;
  const range = `Vin ${formatVolts(spec.vinMinV)} to ${formatVolts(spec.vinMaxV)}`;
  return (
    <div className="grid grid-cols-1 gap-4 lg:grid-cols-2">
      <ChartCard
        name="switch-stress"
        title="Switch voltage across the input range"
        caption={`Main switch off-state voltage, steady state over ${range} (leakage spike and high-line transient not shown); thin dotted line: chosen voltage rating.`}
        chart={<LineChartBox name="switch-stress" series={stress} axes={axes.stress} ariaLabel={`Switch peak voltage against input voltage for ${comparison.results.length} schemes`} />}
      >
        <LineLegend entries={stress.legend} />
      </ChartCard>
      <ChartCard
        name="duty"
        title="Duty across the input range"
        caption={`Switch duty in regulation over ${range} (volt-seconds K/Vin plus the share the leakage inductance takes); thin dotted line: the scheme's duty limit (reset or controller).`}
        chart={<LineChartBox name="duty" series={duty} axes={axes.duty} ariaLabel={`Duty against input voltage for ${comparison.results.length} schemes`} />}
      >
        <LineLegend entries={duty.legend} />
      </ChartCard>
      <ChartCard
        name="losses"
        title="Loss breakdown"
        caption={`Power-stage losses at Vin,nom = ${formatVolts(spec.vinNomV)}, full load, steady state; total above each bar.`}
        height={280}
        chart={<Bar data={loss} options={lossOptions} plugins={lossPlugins} role="img" aria-label="Loss breakdown per scheme in watts" />}
      />
      <ChartCard
        name="cost"
        title="BOM cost breakdown"
        caption={`Power-stage parts at ${spec.annualVolume.toLocaleString('en')} pcs/year from ${comparison.partsLibrary.name}; total above each bar, in ${cost.currency}.`}
        height={280}
        chart={<Bar data={cost} options={costOptions} plugins={costPlugins} role="img" aria-label={`BOM cost breakdown per scheme in ${cost.currency}`} />}
      />
      <WaveformCard comparison={comparison} library={library} />
    </div>
  );
}
