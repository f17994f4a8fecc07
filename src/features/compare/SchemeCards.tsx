import { useStore } from '@nanostores/react';
import { useEffect } from 'react';
import { $evaluation } from '../../stores/evaluation';
import { markRendered } from '../../lib/perf';
import { SCHEME_STYLES } from '../../lib/scheme-style';
import SchemeCard from './SchemeCard';
import { ensureLoaded } from './init';

/** Every scheme side by side, in a fixed order (ranks shown on each card and in the strip). */
export default function SchemeCards() {
  ensureLoaded();
  const { comparison, current } = useStore($evaluation);
  useEffect(() => markRendered('cards'), [comparison, current]);
  if (!comparison) {
    return <p className="card p-6 text-center text-sm text-muted">Enter the required fields to compute the comparison.</p>;
  }
  const rankOf = new Map(comparison.ranking.map((id, i) => [id, i + 1]));
  const input = comparison.input;
  return (
    <section aria-labelledby="cards-title" data-cards data-current={current}>
      <div className="mb-2 flex flex-wrap items-baseline gap-x-4 gap-y-1">
        <h2 id="cards-title" className="font-semibold">Reset schemes</h2>
        <ol className="flex flex-wrap gap-1.5 text-xs" aria-label="Ranking">
          {comparison.ranking.map((id, i) => {
            const result = comparison.results.find((r) => r.scheme === id)!;
            return (
              <li key={id} className="flex items-center gap-1 rounded border border-line bg-panel px-1.5 py-0.5" data-ranking={id}>
                <span className="font-semibold tabular-nums">{i + 1}.</span>
                <span className="inline-block size-2 rounded-full" style={{ background: SCHEME_STYLES[id].color }} aria-hidden="true" />
                <span className={result.feasible ? '' : 'text-muted line-through'}>{result.label}</span>
              </li>
            );
          })}
        </ol>
        {!current && (
          <p className="text-sm text-warn" role="status">Showing the last valid result while the form has errors.</p>
        )}
      </div>
      <div className="grid gap-3 [grid-template-columns:repeat(auto-fill,minmax(17.5rem,1fr))]">
        {comparison.results.map((result) => (
          <SchemeCard
            key={result.scheme} result={result} rank={rankOf.get(result.scheme) ?? 0} of={comparison.results.length}
            stale={!current} activeClampVariant={input.activeClampVariant} rectifier={input.rectifier}
          />
        ))}
      </div>
    </section>
  );
}
