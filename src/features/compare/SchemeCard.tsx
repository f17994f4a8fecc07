import { useState } from 'react';
import { useStore } from '@nanostores/react';
import { $saved } from '../../stores/saved';
import type { SchemeResult, TraceEntry } from '../../engine';
import { SCHEME_STYLES } from '../../lib/scheme-style';
import { formatSi } from '../../lib/si';
import SchemeSchematic from './schematics/SchemeSchematic';
import { FIGURES } from './figures';
import { VERDICT_LABELS, verdictOf } from '../../lib/verdict';

interface Props {
  result: SchemeResult;
  rank: number;
  of: number;
  stale: boolean;
  activeClampVariant: 'high-side' | 'low-side';
  rectifier: 'diode' | 'synchronous';
  /** Caption under the score; default "score · rank N of M". */
  rankText?: string;
  /** SPICE netlist download URL without `vin` (the card adds `vin=min|nom|max`); no link when absent. */
  netlistHref?: string;
}

const VERDICT_CLASS = {
  feasible: 'bg-ok-soft text-ok',
  marginal: 'bg-warn-soft text-warn',
  'not-feasible': 'bg-fail-soft text-fail',
} as const;

function TraceDetail({ label, entry }: { label: string; entry: TraceEntry }) {
  return (
    <div className="mt-2 rounded-md border border-line bg-canvas p-2 text-xs" role="region" aria-label={`How ${label} is computed`} data-trace>
      <p className="font-semibold">{label}</p>
      <p className="mt-1 font-mono text-[11px] leading-snug">{entry.formula}</p>
      {entry.inputs.length > 0 && (
        <ul className="mt-1 grid grid-cols-2 gap-x-3">
          {entry.inputs.map((input) => (
            <li key={input.symbol}>
              {input.symbol} = {input.unit && !['', 'turns', 'pcs', 'pcs/year', 'W/m³', 'm²', 'm³'].includes(input.unit) ? formatSi(input.value, input.unit, 4) : `${Number(input.value.toPrecision(4))} ${input.unit}`.trim()}
            </li>
          ))}
        </ul>
      )}
      <p className="mt-1 text-muted">Source: {entry.source}</p>
    </div>
  );
}

/** One reset scheme: verdict and reasons, key figures (each explainable), score and rank, schematic. */
export default function SchemeCard({ result, rank, of, stale, activeClampVariant, rectifier, rankText, netlistHref }: Props) {
  const [selected, setSelected] = useState<string | null>(null);
  // On Compare the saved set's id gives the netlist of its saved version; elsewhere the caller passes the link.
  const savedId = useStore($saved).specId;
  const netlistUrl = netlistHref ?? (savedId ? `/api/v1/specs/${encodeURIComponent(savedId)}/netlist?scheme=${result.scheme}` : undefined);
  const style = SCHEME_STYLES[result.scheme];
  const verdict = verdictOf(result);
  const reasons = result.findings.filter((f) => f.severity !== 'info');
  const notes = result.findings.filter((f) => f.severity === 'info');
  const selectedFigure = FIGURES.find((f) => f.label === selected);
  const selectedTrace = selectedFigure?.traceKey ? result.trace[selectedFigure.traceKey] : undefined;
  return (
    <article
      className={`card flex flex-col overflow-hidden transition-opacity ${stale ? 'opacity-55' : ''}`}
      aria-labelledby={`card-${result.scheme}`} data-scheme-card={result.scheme} data-verdict={verdict}
    >
      <div className="h-1.5" style={{ background: style.color }} aria-hidden="true" />
      <header className="flex items-start justify-between gap-2 px-3 pt-2">
        <div>
          <h3 id={`card-${result.scheme}`} className="font-semibold" style={{ color: style.color }}>{result.label}</h3>
          <span className={`mt-0.5 inline-block rounded px-1.5 py-0.5 text-xs font-semibold ${VERDICT_CLASS[verdict]}`}>{VERDICT_LABELS[verdict]}</span>
        </div>
        <div className="text-right">
          <p className="text-2xl font-semibold tabular-nums leading-none" data-score>{result.score.toFixed(0)}</p>
          <p className="text-xs text-muted" data-rank={rank}>{rankText ?? `score · rank ${rank} of ${of}`}</p>
        </div>
      </header>
      <div className="px-3 pt-1">
        <SchemeSchematic scheme={result.scheme} activeClampVariant={activeClampVariant} rectifier={rectifier} />
      </div>
      {reasons.length > 0 && (
        <ul className="mx-3 mt-1 space-y-0.5 text-xs" aria-label="Reasons">
          {/* Keyed by code and place, not message: the message holds the live figures, which should update in place. */}
          {reasons.map((f, i) => (
            <li key={`${f.code}-${i}`} className={f.severity === 'fail' ? 'text-fail' : 'text-warn'}>
              <span aria-hidden="true">{f.severity === 'fail' ? '✕ ' : '! '}</span>{f.message}
            </li>
          ))}
        </ul>
      )}
      <dl className="mx-3 mt-2 divide-y divide-line/70 text-sm">
        {FIGURES.map((figure) => {
          const value = figure.value(result);
          if (value === null) return null;
          const explainable = figure.traceKey !== undefined && result.trace[figure.traceKey] !== undefined;
          return (
            <div key={figure.label} className="flex items-baseline justify-between gap-2 py-0.5">
              <dt className="text-muted">{figure.label}</dt>
              <dd className="text-right font-medium tabular-nums" data-figure={figure.label}>
                {explainable ? (
                  <button
                    type="button" aria-expanded={selected === figure.label}
                    className={`rounded px-1 underline decoration-dotted decoration-muted/60 underline-offset-2 hover:bg-canvas ${selected === figure.label ? 'bg-accent-soft' : ''}`}
                    onClick={() => setSelected(selected === figure.label ? null : figure.label)}
                    onFocus={() => setSelected(figure.label)}
                  >
                    {value}
                  </button>
                ) : value}
              </dd>
            </div>
          );
        })}
      </dl>
      <div className="mx-3 mb-3">
        {selectedFigure && selectedTrace ? (
          <TraceDetail label={selectedFigure.label} entry={selectedTrace} />
        ) : (
          <p className="mt-2 text-xs text-muted">Click or focus an underlined figure for its formula and source.</p>
        )}
        {notes.length > 0 && (
          <details className="mt-2 text-xs text-muted">
            <summary className="cursor-pointer">Notes ({notes.length})</summary>
            <ul className="mt-1 list-disc space-y-0.5 pl-4">{notes.map((n) => <li key={n.code}>{n.message}</li>)}</ul>
          </details>
        )}
        {netlistUrl && (
          <p className="mt-2 text-xs" data-netlist>
            <span className="text-muted">SPICE netlist{netlistHref ? '' : ' (saved version)'} at V<sub>in</sub>: </span>
            {(['min', 'nom', 'max'] as const).map((vin, i) => (
              <span key={vin}>{i > 0 && ' · '}<a className="text-accent hover:underline" href={`${netlistUrl}${netlistUrl.includes('?') ? '&' : '?'}vin=${vin}`} download>{vin}</a></span>
            ))}
          </p>
        )}
      </div>
    </article>
  );
}
