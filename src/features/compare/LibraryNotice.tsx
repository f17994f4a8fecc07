import { useStore } from '@nanostores/react';
import { useState } from 'react';
import { $dirty, $saved, saveSpec } from '../../stores/saved';
import { api } from '../../lib/api-client';
import { compareInitial, ensureLoaded, type StoredResult } from './init';
import { formatMoney } from '../../lib/format';

type Row = StoredResult['results'][number];

interface FreshReply {
  libraryVersion: number;
  comparison: { results: { scheme: string; label: string; feasible: boolean; bomCost: number; efficiency: number; details?: { mainSwitchId?: string | null } }[] };
}

const money = (value: number, currency: string): string => (Number.isFinite(value) ? formatMoney(value, currency) : '—');
const pct = (value: number): string => (Number.isFinite(value) ? `${(value * 100).toFixed(1)} %` : '—');

/**
 * "Parts library changed since this result": shown on a saved set whose stored comparison used an
 * older library version. Re-evaluates on the server on request; editors may save the fresh result.
 */
export default function LibraryNotice({ canSave }: { canSave: boolean }) {
  ensureLoaded();
  const initial = compareInitial();
  const dirty = useStore($dirty);
  const saved = useStore($saved);
  const [fresh, setFresh] = useState<Row[] | null>(null);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ text: string; error: boolean } | null>(null);
  const [done, setDone] = useState(false);
  const stored = initial.stored;
  const current = initial.library.version;
  if (!initial.spec || !stored || stored.libraryVersion === current) return null;
  if (!done && saved.specId === initial.spec.id && saved.version > initial.spec.version) return null; // saved since: the server used the current library
  if (done) {
    return <p className="rounded-md border border-ok/40 bg-ok-soft px-3 py-2 text-sm" role="status">Saved as version {saved.version} with parts library version {current}.</p>;
  }
  const currency = initial.library.currency;

  async function reevaluate() {
    setBusy(true);
    setMessage(null);
    const reply = await api<FreshReply>('GET', `/api/v1/specs/${encodeURIComponent(initial.spec!.id)}/comparison?fresh=1`);
    setBusy(false);
    if (!reply.ok) return setMessage({ text: reply.problem.error, error: true });
    setFresh(reply.data.comparison.results.map((r) => ({ scheme: r.scheme, label: r.label, feasible: r.feasible, bomCost: r.bomCost, efficiency: r.efficiency, mainSwitchId: r.details?.mainSwitchId ?? null })));
  }

  async function saveFresh() {
    setBusy(true);
    await saveSpec();
    setBusy(false);
    if ($saved.get().status === 'saved') setDone(true);
    else setMessage({ text: $saved.get().message || 'Saving failed.', error: true });
  }

  return (
    <section className="rounded-md border border-warn/40 bg-warn-soft px-3 py-2 text-sm" data-library-changed aria-labelledby="library-changed-title">
      <p>
        <strong id="library-changed-title">Parts library changed since this result.</strong>{' '}
        The saved result used library version {stored.libraryVersion ?? 'unknown'}
        {stored.evaluatedAt ? ` (${stored.evaluatedAt.slice(0, 16).replace('T', ' ')} UTC)` : ''}; the library is now version {current}.
        The cards below already compute with the current library; the saved result is unchanged until it is saved again.
      </p>
      <div className="mt-2 flex flex-wrap items-center gap-2">
        <button type="button" className="btn" disabled={busy} onClick={reevaluate}>{fresh ? 'Re-evaluate again' : 'Re-evaluate on the server'}</button>
        {fresh && canSave && (
          <button type="button" className="btn btn-primary" disabled={busy || dirty || saved.status === 'saving'} onClick={saveFresh}>Save with library version {current}</button>
        )}
        {fresh && canSave && dirty && <span className="text-muted">The form has unsaved edits: use Save above to store them with the current library.</span>}
        {fresh && !canSave && <span className="text-muted">Fresh result shown, not saved (only architects and admins save).</span>}
        {message && <span className={message.error ? 'text-fail' : 'text-ok'} role="alert">{message.text}</span>}
      </div>
      {fresh && fresh.every((now) => { const b = stored.results.find((r) => r.scheme === now.scheme); return b && Math.abs(b.bomCost - now.bomCost) < 1e-9 && b.mainSwitchId === now.mainSwitchId && b.feasible === now.feasible && Math.abs(b.efficiency - now.efficiency) < 1e-9; }) && (
        <p className="mt-2 text-sm" role="status">No figure below moved: the library change does not touch the parts this set uses.</p>
      )}
      {fresh && (
        <div className="mt-2 overflow-x-auto">
          <table className="table-eng bg-panel" data-library-diff>
            <caption className="sr-only">Saved result against the fresh result per scheme</caption>
            <thead>
              <tr>
                <th>Scheme</th>
                <th className="num">BOM, saved (v{stored.libraryVersion ?? '?'})</th>
                <th className="num">BOM, now (v{current})</th>
                <th className="num">Efficiency saved → now</th>
                <th>Main switch saved → now</th>
                <th>Feasible saved → now</th>
              </tr>
            </thead>
            <tbody>
              {fresh.map((now) => {
                const before = stored.results.find((r) => r.scheme === now.scheme);
                const moved = before && (Math.abs(before.bomCost - now.bomCost) > 1e-9 || before.mainSwitchId !== now.mainSwitchId || before.feasible !== now.feasible);
                return (
                  <tr key={now.scheme} className={moved ? 'font-medium' : ''}>
                    <td>{now.label}</td>
                    <td className="num">{before ? money(before.bomCost, currency) : '—'}</td>
                    <td className="num">{money(now.bomCost, currency)}</td>
                    <td className="num">{before ? pct(before.efficiency) : '—'} → {pct(now.efficiency)}</td>
                    <td className="font-mono text-xs">{before?.mainSwitchId ?? '—'} → {now.mainSwitchId ?? '—'}</td>
                    <td>{before ? (before.feasible ? 'yes' : 'no') : '—'} → {now.feasible ? 'yes' : 'no'}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
