import { useRef, useState } from 'react';
import { categoryInfo } from './categories';
import type { ImportPreview } from './csv-import';

interface Props {
  onApplied: (message: string) => void;
  onClose: () => void;
}

interface DryRunReply { preview: ImportPreview; canApply: boolean; filename: string }

async function send(file: File, query: string): Promise<{ ok: boolean; status: number; data: Record<string, unknown> }> {
  const form = new FormData();
  form.append('file', file);
  try {
    const response = await fetch(`/api/v1/parts/import${query}`, { method: 'POST', body: form });
    return { ok: response.ok, status: response.status, data: (await response.json().catch(() => ({}))) as Record<string, unknown> };
  } catch {
    return { ok: false, status: 0, data: { error: 'The server could not be reached. Check the connection and try again.' } };
  }
}

const OP_LABEL = { add: 'Add', change: 'Change', retire: 'Retire' } as const;
const show = (v: unknown): string => (v === null || v === undefined ? '—' : typeof v === 'object' ? (Array.isArray(v) ? v.map((t) => `${t.minQty}: ${t.unitPrice}`).join(' · ') : JSON.stringify(v)) : String(v));

/** CSV import: choose a file, see what would change (and every row error), then apply or discard. */
export default function ImportPanel({ onApplied, onClose }: Props) {
  const input = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const [preview, setPreview] = useState<DryRunReply | null>(null);
  const [error, setError] = useState('');
  const [busy, setBusy] = useState(false);

  async function runPreview() {
    if (!file) return setError('Choose a CSV file first.');
    setBusy(true);
    setError('');
    setPreview(null);
    const reply = await send(file, '?dryRun=1');
    setBusy(false);
    if (reply.ok) setPreview(reply.data as unknown as DryRunReply);
    else setError(String(reply.data.error ?? `The server answered ${reply.status}.`));
  }

  async function apply() {
    if (!file || !preview) return;
    setBusy(true);
    const reply = await send(file, `?baseVersion=${preview.preview.baseVersion}`);
    setBusy(false);
    if (reply.ok) onApplied(`Imported ${preview.filename}: library version ${String(reply.data.version)}.`);
    else setError(String(reply.data.error ?? `The server answered ${reply.status}.`));
  }

  const p = preview?.preview;
  const counts = p ? { add: p.changes.filter((c) => c.op === 'add').length, change: p.changes.filter((c) => c.op === 'change').length, retire: p.changes.filter((c) => c.op === 'retire').length } : null;
  return (
    <section className="card space-y-3 p-4" aria-labelledby="import-title" data-import-panel>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="import-title" className="font-semibold">Import parts from CSV</h2>
        <p className="text-xs text-muted">Same columns as the export; SI units as plain numbers; up to 2 MB. Write <code>retire</code> in the action column to remove a part. Nothing changes until you apply.</p>
      </div>
      <div className="flex flex-wrap items-center gap-2">
        <input ref={input} type="file" accept=".csv,text/csv" aria-label="CSV file" className="text-sm" onChange={(e) => { setFile(e.target.files?.[0] ?? null); setPreview(null); setError(''); }} />
        <button type="button" className="btn" disabled={!file || busy} onClick={runPreview}>{busy && !preview ? 'Reading…' : 'Preview'}</button>
        <button type="button" className="btn" onClick={onClose}>Close</button>
      </div>
      {error && <p className="rounded-md bg-fail-soft px-3 py-2 text-sm text-fail" role="alert" data-import-error>{error}</p>}
      {p && counts && (
        <div className="space-y-3" data-import-preview>
          <p className="text-sm" role="status">
            <strong>{preview!.filename}</strong>: {p.rows} rows read against library version {p.baseVersion} — {counts.add} to add, {counts.change} to change, {counts.retire} to retire, {p.unchanged} unchanged
            {p.errors.length > 0 && <span className="text-fail">, {p.errors.length} row error{p.errors.length === 1 ? '' : 's'}</span>}.
          </p>
          {p.errors.length > 0 && (
            <div className="rounded-md border border-fail/40 bg-fail-soft p-2">
              <p className="text-sm font-medium text-fail">Fix these rows and preview again; nothing can be applied while a row is wrong.</p>
              <table className="table-eng mt-1" data-import-errors>
                <thead><tr><th className="num">Line</th><th>Id</th><th>Problem</th></tr></thead>
                <tbody>{p.errors.map((e, i) => <tr key={i}><td className="num">{e.line}</td><td className="font-mono text-xs">{e.id ?? '—'}</td><td>{e.message}</td></tr>)}</tbody>
              </table>
            </div>
          )}
          {p.problems.map((problem) => <p key={problem} className="text-sm text-fail" role="alert">{problem}</p>)}
          {p.changes.length > 0 && (
            <div className="max-h-96 overflow-auto">
              <table className="table-eng" data-import-changes>
                <thead><tr><th className="num">Line</th><th>Action</th><th>Category</th><th>Id</th><th>What changes</th></tr></thead>
                <tbody>
                  {p.changes.map((c) => (
                    <tr key={`${c.op}-${c.id}`} data-op={c.op}>
                      <td className="num">{c.line}</td>
                      <td><span className={`rounded px-1.5 py-0.5 text-xs font-semibold ${c.op === 'add' ? 'bg-ok-soft text-ok' : c.op === 'retire' ? 'bg-fail-soft text-fail' : 'bg-warn-soft text-warn'}`}>{OP_LABEL[c.op]}</span></td>
                      <td>{categoryInfo(c.category)?.singular ?? c.category}</td>
                      <td className="font-mono text-xs">{c.id}</td>
                      <td className="text-xs">
                        {c.op === 'change' && Object.entries(c.fields ?? {}).map(([k, v]) => <div key={k}><span className="font-medium">{k}</span>: {show(v.from)} → {show(v.to)}</div>)}
                        {c.op === 'add' && 'new part'}
                        {c.op === 'retire' && 'removed from the library (earlier versions keep it)'}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}
          <div className="flex gap-2">
            <button type="button" className="btn btn-primary" disabled={!preview!.canApply || busy} onClick={apply} data-apply>
              {p.changes.length === 0 ? 'Nothing to apply' : `Apply ${p.changes.length} change${p.changes.length === 1 ? '' : 's'} as one new version`}
            </button>
            <button type="button" className="btn" onClick={() => { setPreview(null); setFile(null); if (input.current) input.current.value = ''; }}>Discard</button>
          </div>
        </div>
      )}
    </section>
  );
}
