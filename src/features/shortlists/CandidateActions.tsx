import { useState } from 'react';
import { actThenReload } from './post';

/** Re-evaluate (stale snapshot) and remove buttons for one candidate, owner only, draft only. */
export default function CandidateActions({ shortlistId, candidateId, label, stale }: { shortlistId: string; candidateId: string; label: string; stale: boolean }) {
  const base = `/api/v1/shortlists/${encodeURIComponent(shortlistId)}/candidates/${encodeURIComponent(candidateId)}`;
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const run = async (method: string, url: string, body?: unknown) => {
    setBusy(true);
    setError(await actThenReload(method, url, body));
    setBusy(false);
  };
  return (
    <div className="flex flex-wrap gap-2">
      {stale && <button type="button" className="btn py-0.5 text-xs" disabled={busy} onClick={() => run('POST', `${base}/reevaluate`, {})}>Re-evaluate</button>}
      <button type="button" className="btn py-0.5 text-xs" disabled={busy} onClick={() => window.confirm(`Remove ${label} from the shortlist?`) && run('DELETE', base)} aria-label={`Remove ${label}`}>Remove</button>
      {error && <p role="alert" className="basis-full text-xs text-fail">{error}</p>}
    </div>
  );
}
