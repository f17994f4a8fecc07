import { useId, useState } from 'react';
import { api, type ApiProblem } from '../../lib/api-client';

export interface SpecOption {
  id: string;
  name: string;
  customer: string;
}

export interface ShortlistOption {
  id: string;
  title: string;
  specId: string;
  schemeLabel: string | null;
}

interface Props {
  specs: SpecOption[];
  shortlists: ShortlistOption[];
  initialSpecId: string | null;
}

/** Starts a brief from a requirement set (or one of its decided shortlists) and opens it. */
export default function NewBriefForm({ specs, shortlists, initialSpecId }: Props) {
  const id = useId();
  const first = specs.find((s) => s.id === initialSpecId) ?? specs[0];
  const [specId, setSpecId] = useState(first?.id ?? '');
  const [shortlistId, setShortlistId] = useState('');
  const [customerName, setCustomerName] = useState(first?.customer ?? '');
  const [customerContact, setCustomerContact] = useState('');
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<ApiProblem | null>(null);
  const options = shortlists.filter((s) => s.specId === specId);
  const fieldError = (name: string) => problem?.fields?.find((f) => f.field === name)?.message;

  if (specs.length === 0) return <p className="text-sm text-muted">No requirement set to write about yet. An architect creates one on the Specs screen first.</p>;

  async function submit(): Promise<void> {
    setBusy(true);
    setProblem(null);
    const result = await api<{ id: string }>('POST', '/api/v1/briefs', {
      specId, ...(shortlistId ? { shortlistId } : {}), ...(customerName.trim() ? { customerName } : {}), customerContact,
    });
    if (!result.ok) {
      setBusy(false);
      return setProblem(result.problem);
    }
    window.location.assign(`/briefs/${encodeURIComponent(result.data.id)}`);
  }

  return (
    <form className="grid gap-3 md:grid-cols-2" onSubmit={(e) => { e.preventDefault(); void submit(); }} data-new-brief>
      <div className="md:col-span-2">
        <label htmlFor={`${id}-spec`} className="label">Requirement set</label>
        <select id={`${id}-spec`} className="field" value={specId} onChange={(e) => {
          const spec = specs.find((s) => s.id === e.target.value);
          setSpecId(e.target.value);
          setShortlistId('');
          setCustomerName(spec?.customer ?? '');
        }}>
          {specs.map((s) => <option key={s.id} value={s.id}>{s.name}{s.customer ? ` — ${s.customer}` : ''}</option>)}
        </select>
        {fieldError('specId') && <p className="mt-1 text-xs text-fail">{fieldError('specId')}</p>}
      </div>
      <div className="md:col-span-2">
        <label htmlFor={`${id}-shortlist`} className="label">Start from</label>
        <select id={`${id}-shortlist`} className="field" value={shortlistId} onChange={(e) => setShortlistId(e.target.value)} disabled={options.length === 0}>
          <option value="">The requirement set (engine's best feasible scheme)</option>
          {options.map((s) => <option key={s.id} value={s.id}>Decided shortlist: {s.title}{s.schemeLabel ? ` → ${s.schemeLabel}` : ''}</option>)}
        </select>
        {options.length === 0 && <p className="mt-1 text-xs text-muted">No decided shortlist for this requirement set.</p>}
      </div>
      <div>
        <label htmlFor={`${id}-customer`} className="label">Customer</label>
        <input id={`${id}-customer`} className="field" value={customerName} onChange={(e) => setCustomerName(e.target.value)} required aria-invalid={fieldError('customerName') ? true : undefined} />
        {fieldError('customerName') && <p className="mt-1 text-xs text-fail">{fieldError('customerName')}</p>}
      </div>
      <div>
        <label htmlFor={`${id}-contact`} className="label">Contact</label>
        <input id={`${id}-contact`} className="field" value={customerContact} onChange={(e) => setCustomerContact(e.target.value)} placeholder="name, e-mail" />
      </div>
      <div className="md:col-span-2 flex items-center gap-3">
        <button type="submit" className="btn btn-primary" disabled={busy || !specId}>{busy ? 'Creating…' : 'Create brief'}</button>
        {problem && <p className="text-sm text-fail" role="alert">{problem.error}</p>}
      </div>
    </form>
  );
}
