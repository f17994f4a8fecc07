import { useState } from 'react';
import { api } from '../../lib/api-client';

/** Starts a draft shortlist for a spec and opens it. */
export default function NewShortlist({ specs, initialSpecId }: { specs: { id: string; name: string }[]; initialSpecId: string | null }) {
  const [specId, setSpecId] = useState(initialSpecId ?? specs[0]?.id ?? '');
  const [title, setTitle] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function create() {
    setBusy(true);
    const result = await api<{ id: string }>('POST', '/api/v1/shortlists', { specId, title });
    setBusy(false);
    if (result.ok) window.location.assign(`/shortlists/${encodeURIComponent(result.data.id)}`);
    else setError(result.problem.fields?.map((f) => f.message).join('; ') || result.problem.error);
  }
  if (specs.length === 0) return <p className="card p-4 text-sm text-muted">Create a requirement set first; a shortlist belongs to one.</p>;
  return (
    <form className="card flex flex-wrap items-end gap-3 p-4" onSubmit={(e) => { e.preventDefault(); void create(); }} aria-label="New shortlist">
      <div>
        <label className="label" htmlFor="new-shortlist-spec">Requirement set</label>
        <select id="new-shortlist-spec" className="field" value={specId} onChange={(e) => setSpecId(e.target.value)}>
          {specs.map((s) => <option key={s.id} value={s.id}>{s.name}</option>)}
        </select>
      </div>
      <div className="min-w-64 flex-1">
        <label className="label" htmlFor="new-shortlist-title">Title</label>
        <input id="new-shortlist-title" className="field" value={title} onChange={(e) => setTitle(e.target.value)} placeholder="e.g. Reset scheme for the 500 W server stage" />
      </div>
      <button type="submit" className="btn btn-primary" disabled={busy}>New shortlist</button>
      {error && <p role="alert" className="basis-full text-sm text-fail">{error}</p>}
    </form>
  );
}
