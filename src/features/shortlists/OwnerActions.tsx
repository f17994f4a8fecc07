import { useState } from 'react';
import { actThenReload } from './post';

interface Props {
  shortlistId: string;
  status: 'draft' | 'voting' | 'closed' | 'decided' | 'withdrawn';
  deadline: string | null;
  candidateCount: number;
  candidates: { id: string; label: string }[];
  eligibleVoters: { id: string; name: string; role: string }[];
  invited: string[];
}

/** Local date-time text for <input type="datetime-local">, two days from now at 17:00. */
function defaultDeadline(): string {
  const d = new Date(Date.now() + 2 * 86_400_000);
  d.setHours(17, 0, 0, 0);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/** The owner's controls: open or extend voting, close it, record the decision, withdraw. */
export default function OwnerActions({ shortlistId, status, deadline, candidateCount, candidates, eligibleVoters, invited }: Props) {
  const base = `/api/v1/shortlists/${encodeURIComponent(shortlistId)}`;
  const [when, setWhen] = useState(defaultDeadline());
  const [voters, setVoters] = useState<Set<string>>(new Set(invited));
  const [choice, setChoice] = useState(candidates[0]?.id ?? '');
  const [rationale, setRationale] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function run(method: string, url: string, body: unknown = {}) {
    setBusy(true);
    setError(await actThenReload(method, url, body));
    setBusy(false);
  }
  const open = () => {
    const at = new Date(when);
    if (Number.isNaN(at.getTime())) return setError('Enter a deadline date and time.');
    return run('POST', `${base}/open`, { deadline: at.toISOString(), voterIds: [...voters] });
  };

  return (
    <section className="card p-4" aria-labelledby="owner-title" data-owner-actions>
      <h2 id="owner-title" className="mb-2 font-semibold">Owner actions</h2>
      {(status === 'draft' || status === 'voting') && (
        <div className="space-y-2">
          <p className="text-sm text-muted">
            {status === 'draft'
              ? candidateCount < 2 ? 'Add at least two candidates (from Compare) before opening the ballot.' : 'Invite voters and set a deadline; they get an e-mail with a link.'
              : `Voting closes ${deadline ? new Date(deadline).toLocaleString() : ''}. Extend it or invite more voters here.`}
          </p>
          <fieldset>
            <legend className="label">Voters (engineers and architects)</legend>
            <div className="grid gap-x-4 sm:grid-cols-2">
              {eligibleVoters.map((v) => (
                <label key={v.id} className="flex items-center gap-2 text-sm">
                  <input
                    type="checkbox" checked={voters.has(v.id)} disabled={status === 'voting' && invited.includes(v.id)}
                    onChange={(e) => { const next = new Set(voters); if (e.target.checked) next.add(v.id); else next.delete(v.id); setVoters(next); }}
                  />
                  {v.name} <span className="text-xs text-muted">{v.role}</span>
                </label>
              ))}
            </div>
          </fieldset>
          <div className="flex flex-wrap items-end gap-2">
            <div>
              <label className="label" htmlFor="deadline">Deadline (your local time)</label>
              <input id="deadline" type="datetime-local" className="field" value={when} onChange={(e) => setWhen(e.target.value)} />
            </div>
            <button type="button" className="btn btn-primary" disabled={busy || candidateCount < 2 || voters.size === 0} onClick={open}>
              {status === 'draft' ? 'Open voting' : 'Extend / invite'}
            </button>
            {status === 'voting' && <button type="button" className="btn" disabled={busy} onClick={() => run('POST', `${base}/close`)}>Close voting</button>}
          </div>
        </div>
      )}
      {status === 'closed' && (
        <div className="space-y-2">
          <p className="text-sm text-muted">Voting is closed. Record the chosen candidate and why; the shortlist then becomes read-only.</p>
          <label className="label" htmlFor="decision-candidate">Chosen candidate</label>
          <select id="decision-candidate" className="field" value={choice} onChange={(e) => setChoice(e.target.value)}>
            {candidates.map((c) => <option key={c.id} value={c.id}>{c.label}</option>)}
          </select>
          <label className="label" htmlFor="decision-rationale">Rationale</label>
          <textarea id="decision-rationale" className="field min-h-20" value={rationale} onChange={(e) => setRationale(e.target.value)} placeholder="Why this scheme: stress margin, cost at volume, concerns resolved…" />
          <button type="button" className="btn btn-primary" disabled={busy} onClick={() => run('POST', `${base}/decision`, { candidateId: choice, rationale })}>Record decision</button>
        </div>
      )}
      {status !== 'decided' && status !== 'withdrawn' && (
        <button
          type="button" className="btn mt-3 text-xs" disabled={busy}
          onClick={() => window.confirm('Withdraw this shortlist? It will not be decided.') && run('POST', `${base}/withdraw`)}
        >
          Withdraw shortlist
        </button>
      )}
      {error && <p role="alert" className="mt-2 text-sm text-fail">{error}</p>}
    </section>
  );
}
