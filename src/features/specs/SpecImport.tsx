import { useState } from 'react';

interface Problem { error: string; fields?: { field: string; message: string }[] }

/** Upload a customer's requirement set (JSON or CSV, API field names, values with units). */
export default function SpecImport() {
  const [file, setFile] = useState<File | null>(null);
  const [name, setName] = useState('');
  const [customer, setCustomer] = useState('');
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<Problem | null>(null);

  async function submit(event: React.SyntheticEvent) {
    event.preventDefault();
    if (!file) return setProblem({ error: 'Choose the customer\'s file first.' });
    const form = new FormData();
    form.append('file', file);
    if (name.trim()) form.append('name', name.trim());
    if (customer.trim()) form.append('customer', customer.trim());
    setBusy(true);
    setProblem(null);
    try {
      const response = await fetch('/api/v1/specs/import', { method: 'POST', body: form });
      const data = (await response.json().catch(() => ({}))) as Problem & { id?: string };
      if (response.ok && data.id) return window.location.assign(`/compare/${encodeURIComponent(data.id)}`);
      setProblem({ error: data.error ?? `The server answered ${response.status}.`, ...(data.fields ? { fields: data.fields } : {}) });
    } catch {
      setProblem({ error: 'The server could not be reached. Check the connection and try again.' });
    } finally {
      setBusy(false);
    }
  }

  return (
    <form className="card max-w-2xl space-y-3 p-4" onSubmit={submit} noValidate data-spec-import>
      <label className="block"><span className="label">Customer's file (.json or .csv, at most 2 MB)</span>
        <input type="file" accept=".json,.csv,application/json,text/csv" className="text-sm" onChange={(e) => setFile(e.target.files?.[0] ?? null)} />
      </label>
      <div className="grid gap-3 sm:grid-cols-2">
        <label className="block"><span className="label">Name (optional)</span><input className="field" value={name} maxLength={160} onChange={(e) => setName(e.target.value)} placeholder="from the file, or its file name" /></label>
        <label className="block"><span className="label">Customer (optional)</span><input className="field" value={customer} maxLength={160} onChange={(e) => setCustomer(e.target.value)} placeholder="from the file" /></label>
      </div>
      {problem && (
        <div className="rounded-md border border-fail/40 bg-fail-soft px-3 py-2 text-sm" role="alert" data-import-problem>
          <p className="font-medium text-fail">{problem.error}</p>
          {problem.fields && <ul className="mt-1 list-disc pl-5">{problem.fields.map((f) => <li key={f.field + f.message}><span className="font-mono text-xs">{f.field.replace(/^requirements\./, '')}</span>: {f.message}</li>)}</ul>}
        </div>
      )}
      <button type="submit" className="btn btn-primary" disabled={busy}>{busy ? 'Importing…' : 'Import and compare'}</button>
    </form>
  );
}
