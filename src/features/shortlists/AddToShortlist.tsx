import { useStore } from '@nanostores/react';
import { useState } from 'react';
import { SCHEME_IDS, SCHEME_LABELS, type SchemeId } from '../../engine/scheme-ids';
import { $dirty, $saved } from '../../stores/saved';
import { $overrides } from '../../stores/overrides';
import { $evaluation } from '../../stores/evaluation';
import { api } from '../../lib/api-client';

interface Props {
  specId: string;
  drafts: { id: string; title: string }[];
  canCreate: boolean;
}

const NEW = '__new__';

/** Freezes one scheme of the saved spec into a draft shortlist (or a new one). */
export default function AddToShortlist({ specId, drafts, canCreate }: Props) {
  const dirty = useStore($dirty);
  const saved = useStore($saved);
  const overrides = useStore($overrides);
  // Preselect the scheme the live comparison ranks first (the one a team shortlists most often).
  const ranked = useStore($evaluation);
  const [picked, setScheme] = useState<SchemeId | null>(null);
  const scheme: SchemeId = picked ?? ranked.comparison?.ranking[0] ?? SCHEME_IDS[0];
  const [target, setTarget] = useState(drafts[0]?.id ?? (canCreate ? NEW : ''));
  const [title, setTitle] = useState('');
  const [note, setNote] = useState('');
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ text: string; link?: string; error: boolean } | null>(null);
  const [known, setKnown] = useState(drafts);

  if (known.length === 0 && !canCreate) return null;

  async function add() {
    setBusy(true);
    setMessage(null);
    let shortlistId = target;
    if (target === NEW) {
      const created = await api<{ id: string }>('POST', '/api/v1/shortlists', { specId, title: title || `Reset scheme for ${specId}` });
      if (!created.ok) {
        setBusy(false);
        return setMessage({ text: created.problem.fields?.map((f) => f.message).join('; ') || created.problem.error, error: true });
      }
      shortlistId = created.data.id;
      setKnown([...known, { id: shortlistId, title }]);
      setTarget(shortlistId);
    }
    const result = await api('POST', `/api/v1/shortlists/${encodeURIComponent(shortlistId)}/candidates`, { scheme, note, ...(overrides[scheme] ? { overrides: overrides[scheme] } : {}) });
    setBusy(false);
    if (result.ok) {
      setNote('');
      setMessage({ text: `${SCHEME_LABELS[scheme]} added, frozen from saved version ${saved.version}.`, link: `/shortlists/${encodeURIComponent(shortlistId)}`, error: false });
    } else setMessage({ text: result.problem.fields?.map((f) => f.message).join('; ') || result.problem.error, error: true });
  }

  return (
    <section className="card flex flex-wrap items-end gap-2 px-3 py-2" aria-label="Add to shortlist" data-add-to-shortlist>
      <div>
        <label className="label" htmlFor="sl-scheme">Add to shortlist</label>
        <select id="sl-scheme" className="field" value={scheme} onChange={(e) => setScheme(e.target.value as SchemeId)}>
          {SCHEME_IDS.map((id) => <option key={id} value={id}>{SCHEME_LABELS[id]}</option>)}
        </select>
      </div>
      <div>
        <label className="label" htmlFor="sl-target">Shortlist</label>
        <select id="sl-target" className="field" value={target} onChange={(e) => setTarget(e.target.value)}>
          {known.map((d) => <option key={d.id} value={d.id}>{d.title}</option>)}
          {canCreate && <option value={NEW}>New shortlist…</option>}
        </select>
      </div>
      {target === NEW && (
        <div>
          <label className="label" htmlFor="sl-title">Title</label>
          <input id="sl-title" className="field" value={title} onChange={(e) => setTitle(e.target.value)} placeholder="Shortlist title" />
        </div>
      )}
      <div className="min-w-48 flex-1">
        <label className="label" htmlFor="sl-note">Note</label>
        <input id="sl-note" className="field" value={note} onChange={(e) => setNote(e.target.value)} placeholder="Why this candidate" />
      </div>
      <button type="button" className="btn" disabled={busy || !target || (target === NEW && !title.trim())} onClick={add}>Add</button>
      {dirty && <p className="basis-full text-xs text-warn">Candidates are frozen from the saved version {saved.version}; save first to include your edits.</p>}
      {message && (
        <p role="status" className={`basis-full text-sm ${message.error ? 'text-fail' : 'text-ok'}`}>
          {message.text} {message.link && <a className="text-accent underline" href={message.link}>Open the shortlist</a>}
        </p>
      )}
    </section>
  );
}
