import { useState } from 'react';
import { SCHEME_STYLES } from '../../lib/scheme-style';
import type { SchemeId } from '../../engine/scheme-ids';
import { actThenReload } from './post';

interface Choice {
  id: string;
  scheme: SchemeId;
  label: string;
  note: string;
}

interface Props {
  shortlistId: string;
  choices: Choice[];
  initial: { ranking: string[]; concerns: { candidateId: string; reason: string }[]; comment: string } | null;
}

/** Rank every candidate (drag, or the arrow buttons), flag blocking concerns with a reason, comment. */
export default function BallotPanel({ shortlistId, choices, initial }: Props) {
  const byId = new Map(choices.map((c) => [c.id, c]));
  const startOrder = initial && initial.ranking.length === choices.length && initial.ranking.every((id) => byId.has(id)) ? initial.ranking : choices.map((c) => c.id);
  const [order, setOrder] = useState<string[]>(startOrder);
  const [concerns, setConcerns] = useState<Record<string, string | undefined>>(Object.fromEntries((initial?.concerns ?? []).map((c) => [c.candidateId, c.reason])));
  const [comment, setComment] = useState(initial?.comment ?? '');
  const [dragging, setDragging] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [announce, setAnnounce] = useState('');

  function move(id: string, delta: number) {
    setOrder((list) => {
      const from = list.indexOf(id);
      const to = from + delta;
      if (to < 0 || to >= list.length) return list;
      const next = [...list];
      next.splice(from, 1);
      next.splice(to, 0, id);
      setAnnounce(`${byId.get(id)?.label} moved to position ${to + 1}`);
      return next;
    });
  }

  function dropOn(target: string) {
    if (!dragging || dragging === target) return;
    setOrder((list) => {
      const next = list.filter((id) => id !== dragging);
      next.splice(next.indexOf(target), 0, dragging);
      return next;
    });
    setDragging(null);
  }

  async function submit() {
    const missing = Object.entries(concerns).find(([, reason]) => reason !== undefined && reason.trim().length < 3);
    if (missing) return setError(`Give a reason for the blocking concern on ${byId.get(missing[0])?.label}.`);
    setBusy(true);
    setError(null);
    const body = {
      ranking: order,
      concerns: Object.entries(concerns).filter(([, r]) => r !== undefined).map(([candidateId, reason]) => ({ candidateId, reason: reason!.trim() })),
      comment,
    };
    const problem = await actThenReload('PUT', `/api/v1/shortlists/${encodeURIComponent(shortlistId)}/ballot`, body);
    setBusy(false);
    setError(problem);
  }

  return (
    <section className="card p-4" aria-labelledby="ballot-title" data-ballot>
      <h2 id="ballot-title" className="font-semibold">{initial ? 'Your ballot (you may change it until voting closes)' : 'Your ballot'}</h2>
      <p className="mb-2 text-sm text-muted">Best first. Drag a row, or use the arrow buttons. Results show once you have voted.</p>
      <ol className="space-y-1.5" aria-label="Your ranking">
        {order.map((id, index) => {
          const choice = byId.get(id)!;
          const concern = concerns[id];
          return (
            <li
              key={id} draggable onDragStart={() => setDragging(id)} onDragOver={(e) => e.preventDefault()} onDrop={() => dropOn(id)}
              className={`rounded-md border border-line bg-panel px-2 py-1.5 ${dragging === id ? 'opacity-50' : ''}`} data-ballot-row={choice.scheme}
            >
              <div className="flex items-center gap-2">
                <span className="w-5 text-right font-semibold tabular-nums">{index + 1}.</span>
                <span className="cursor-grab select-none text-muted" aria-hidden="true">⠿</span>
                <span className="inline-block size-2.5 rounded-full" style={{ background: SCHEME_STYLES[choice.scheme].color }} aria-hidden="true" />
                <span className="whitespace-nowrap font-medium">{choice.label}</span>
                <span className="ml-auto flex gap-1">
                  <button type="button" className="btn px-2 py-0.5" onClick={() => move(id, -1)} disabled={index === 0} aria-label={`Move ${choice.label} up`}>↑</button>
                  <button type="button" className="btn px-2 py-0.5" onClick={() => move(id, 1)} disabled={index === order.length - 1} aria-label={`Move ${choice.label} down`}>↓</button>
                </span>
              </div>
              {choice.note && <p className="truncate pl-7 text-xs text-muted">{choice.note}</p>}
              <label className="mt-1 flex items-center gap-1.5 pl-7 text-xs">
                <input type="checkbox" checked={concern !== undefined} onChange={(e) => setConcerns({ ...concerns, [id]: e.target.checked ? '' : undefined })} />
                Blocking concern
              </label>
              {concern !== undefined && (
                <div className="pl-7 pt-1">
                  <label className="sr-only" htmlFor={`concern-${id}`}>Reason for the concern on {choice.label}</label>
                  <input id={`concern-${id}`} className="field text-xs" placeholder="Why this candidate must not be chosen (required)" value={concern} onChange={(e) => setConcerns({ ...concerns, [id]: e.target.value })} />
                </div>
              )}
            </li>
          );
        })}
      </ol>
      <p className="sr-only" aria-live="polite">{announce}</p>
      <label className="label mt-3" htmlFor="ballot-comment">Comment (optional)</label>
      <textarea id="ballot-comment" className="field min-h-16" value={comment} onChange={(e) => setComment(e.target.value)} />
      {error && <p role="alert" className="mt-2 text-sm text-fail">{error}</p>}
      <button type="button" className="btn btn-primary mt-3" onClick={submit} disabled={busy}>{busy ? 'Recording…' : initial ? 'Change my ballot' : 'Cast my ballot'}</button>
    </section>
  );
}
