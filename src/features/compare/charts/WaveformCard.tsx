import { useMemo, useState } from 'react';
import type { Comparison, PartsLibrary, SchemeId } from '../../../engine/index';
import { ChartCard } from './ChartCard';
import { formatAmps, formatMicroseconds, formatVolts } from '../../../lib/format';
import { LineChartBox } from './LineChartBox';
import type { LineAxes } from './options';
import { SchemeSelector } from './SchemeSelector';
import { useStable } from './stable';
import { LineLegend } from './Swatch';
import { buildWaveSeries } from './wave-series';

const time = { xTitle: 'Time (µs)', xTick: (x: number) => String(Number(x.toPrecision(3))), tooltipTitle: (x: number) => `t = ${formatMicroseconds(x)}`, xRoundOnly: true };
const volts = (yTitle: string): LineAxes => ({ ...time, yTitle, yTick: (y) => String(Number(y.toPrecision(3))), tooltipLabel: (d, y) => `${d.label}: ${formatVolts(y)}`, exactY: true });
const amps = (yTitle: string): LineAxes => ({ ...time, yTitle, yTick: (y) => String(Number(y.toPrecision(3))), tooltipLabel: (d, y) => `${d.label}: ${formatAmps(y)}`, exactY: true });
const AXES = { drain: volts('Switch voltage (V)'), currents: amps('Primary current (A)'), secondary: volts('Secondary voltage (V)'), inductor: amps('Inductor current (A)') };

/** Idealised waveforms of one scheme at a time (two switching periods), with a scheme picker. */
export function WaveformCard({ comparison, library }: { comparison: Comparison; library: PartsLibrary }) {
  // Kept while the schemes and their names stay the same, so the memoised picker is not re-rendered.
  const options = useStable(useMemo(() => comparison.results.map((r) => ({ scheme: r.scheme, label: r.label })), [comparison]));
  const [picked, setPicked] = useState<SchemeId | null>(null);
  // Keep the user's pick while it is still evaluated; otherwise show the best-ranked scheme.
  const scheme = options.some((o) => o.scheme === picked) ? picked! : (comparison.ranking.find((id) => options.some((o) => o.scheme === id)) ?? options[0]?.scheme);
  const waves = useMemo(() => {
    if (!scheme) return null;
    try {
      return buildWaveSeries(comparison, scheme, library);
    } catch (error) {
      return error instanceof Error ? error : new Error(String(error));
    }
  }, [comparison, scheme, library]);
  const ok = waves instanceof Error ? null : waves;
  // Each panel keeps its series while an edit leaves it unchanged, so its chart is not updated.
  const stable = { drain: useStable(ok?.drain ?? null), currents: useStable(ok?.currents ?? null), secondary: useStable(ok?.secondary ?? null), inductor: useStable(ok?.inductor ?? null) };
  if (!scheme) return null;
  const result = comparison.results.find((r) => r.scheme === scheme);
  const label = result?.label ?? scheme;
  const panel = (title: string, key: keyof typeof AXES, aria: string) => {
    const series = stable[key];
    return series ? (
      <ChartCard bare level={4} name={`waveform-${key}`} title={title} height={200} chart={<LineChartBox name={`waveform-${key}`} series={series} axes={AXES[key]} ariaLabel={`${aria}, ${label}`} />}>
        <LineLegend entries={series.legend} />
      </ChartCard>
    ) : null;
  };

  return (
    <section aria-labelledby="compare-waveforms-title" className="card flex min-w-0 flex-col gap-3 p-3 lg:col-span-2">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <h3 id="compare-waveforms-title" className="text-sm font-semibold text-ink">
            Idealised waveforms · {label}
          </h3>
          <p className="text-xs text-muted">
            Two switching periods at Vin,nom = {formatVolts(comparison.input.vinNomV)}, full load, steady state; leakage spikes, ringing and switching edges are not shown.
          </p>
        </div>
        <SchemeSelector label="Scheme for the waveforms" options={options} value={scheme} onChange={setPicked} />
      </div>
      {waves instanceof Error ? (
        <p className="text-sm text-fail">The waveforms of {label} could not be drawn: {waves.message}</p>
      ) : (
        <div className="grid gap-x-6 gap-y-4 md:grid-cols-2">
          {panel(ok && ok.seriesSwitches > 1 ? 'Voltage across each switch' : 'Main switch drain–source voltage', 'drain', 'Switch voltage over two periods')}
          {panel('Primary and magnetizing current', 'currents', 'Primary and magnetizing current over two periods')}
          {panel('Secondary winding voltage', 'secondary', 'Secondary winding voltage over two periods')}
          {panel('Output inductor current', 'inductor', 'Output inductor current over two periods')}
        </div>
      )}
    </section>
  );
}
