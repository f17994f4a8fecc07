import { useStore } from '@nanostores/react';
import { $weights, resetWeights, setWeight } from '../../stores/weights';
import type { ScoreWeights } from '../../schemas/spec';
import { ensureLoaded } from './init';

const WEIGHTS: { key: keyof ScoreWeights; label: string; hint: string }[] = [
  { key: 'stress', label: 'Switch stress', hint: 'lower off-state voltage and rating' },
  { key: 'dutyHeadroom', label: 'Duty headroom', hint: 'margin between the duty needed and the limit' },
  { key: 'partCount', label: 'Part count', hint: 'fewer power-stage parts' },
  { key: 'cost', label: 'BOM cost', hint: 'at the annual volume' },
  { key: 'efficiency', label: 'Efficiency', hint: 'at nominal input, full load' },
];

/** Score weights; the ranking on every card follows them live. */
export default function WeightsPanel() {
  ensureLoaded();
  const weights = useStore($weights);
  const total = WEIGHTS.reduce((sum, w) => sum + weights[w.key], 0);
  return (
    <section className="card p-4" aria-labelledby="weights-title" data-weights>
      <div className="mb-2 flex items-baseline justify-between">
        <h2 id="weights-title" className="font-semibold">Score weights</h2>
        <button type="button" className="btn py-0.5 text-xs" onClick={resetWeights}>Defaults</button>
      </div>
      <div className="space-y-2">
        {WEIGHTS.map((w) => {
          const share = total > 0 ? weights[w.key] / total : 0;
          return (
            <div key={w.key}>
              <div className="flex items-baseline justify-between text-sm">
                <label htmlFor={`weight-${w.key}`}>{w.label}</label>
                <span className="tabular-nums text-muted" aria-live="polite">{Math.round(share * 100)} %</span>
              </div>
              <input
                id={`weight-${w.key}`} type="range" min={0} max={100} step={5} className="w-full accent-accent"
                value={Math.round(weights[w.key] * 100)} aria-describedby={`weight-${w.key}-hint`}
                onChange={(e) => setWeight(w.key, Number(e.target.value) / 100)}
              />
              <p id={`weight-${w.key}-hint`} className="text-xs text-muted">{w.hint}</p>
            </div>
          );
        })}
      </div>
      {total === 0 && <p className="mt-2 text-sm text-fail">Give at least one weight a value above zero.</p>}
    </section>
  );
}
