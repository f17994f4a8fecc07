import { useMemo, useState } from 'react';
import { partsOf, type PartsLibrary } from '../../engine/parts/types';
import { api } from '../../lib/api-client';
import { CATEGORIES, STATUS_LABELS, type CategoryInfo } from './categories';
import { displayValue } from './si-input';
import PartForm from './PartForm';
import ImportPanel from './ImportPanel';

type Part = Record<string, unknown> & { id: string; status: keyof typeof STATUS_LABELS; tiers: { minQty: number; unitPrice: number }[] };

interface Props {
  library: PartsLibrary;
  version: number;
  canEdit: boolean;
}

const STATUS_STYLE: Record<string, string> = { preferred: 'bg-ok-soft text-ok', allowed: 'bg-accent-soft text-accent-strong', nfnd: 'bg-fail-soft text-fail' };
/** Tables open sorted by the key rating (VDS, VRRM, capacitance…), as a parts board reads them. */
const ratingKey = (c: CategoryInfo): string => c.fields.find((f) => f.kind === 'number')?.key ?? 'id';
const qtyText = (q: number): string => (q >= 1e6 ? `${q / 1e6}M` : q >= 1e3 ? `${q / 1e3}k` : String(q));

/** The Parts library: one table per category with search, status filter and sort; admins edit and import. */
export default function PartsScreen({ library: initialLibrary, version: initialVersion, canEdit }: Props) {
  const [library, setLibrary] = useState(initialLibrary);
  const [version, setVersion] = useState(initialVersion);
  const [tab, setTab] = useState<CategoryInfo>(CATEGORIES[0]!);
  const [query, setQuery] = useState('');
  const [status, setStatus] = useState('');
  const [sort, setSort] = useState<{ key: string; dir: 1 | -1 }>({ key: ratingKey(CATEGORIES[0]!), dir: 1 });
  const [editing, setEditing] = useState<Part | 'new' | null>(null);
  const [importing, setImporting] = useState(false);
  const [message, setMessage] = useState<{ text: string; error: boolean } | null>(null);

  const parts: readonly Part[] = partsOf(library, tab.key);
  const shown = useMemo(() => {
    const q = query.trim().toLowerCase();
    const list = parts.filter((p) => (!status || p.status === status) && (!q || `${p.id} ${p.description ?? ''} ${tab.fields.map((f) => String(p[f.key])).join(' ')}`.toLowerCase().includes(q)));
    const value = (p: Part): number | string => (sort.key === 'price' ? p.tiers[0]?.unitPrice ?? 0 : (p[sort.key] as number | string) ?? '');
    return [...list].sort((a, b) => {
      const x = value(a);
      const y = value(b);
      return (typeof x === 'number' && typeof y === 'number' ? x - y : String(x).localeCompare(String(y), 'en', { numeric: true })) * sort.dir;
    });
  }, [parts, query, status, sort, tab]);

  async function reload(text: string) {
    const result = await api<{ library: PartsLibrary; version: number }>('GET', '/api/v1/parts');
    if (result.ok) {
      setLibrary(result.data.library);
      setVersion(result.data.version);
    }
    setEditing(null);
    setImporting(false);
    setMessage({ text, error: false });
  }

  async function retire(part: Part) {
    if (!window.confirm(`Retire ${part.id}? It leaves the current library; earlier versions and saved results keep it.`)) return;
    const result = await api<{ version: number }>('DELETE', `/api/v1/parts/${encodeURIComponent(part.id)}?baseVersion=${version}`);
    if (result.ok) await reload(`Retired ${part.id}: library version ${result.data.version}.`);
    else setMessage({ text: [result.problem.error, ...(result.problem.fields ?? []).map((f) => f.message)].join(' '), error: true });
  }

  const header = (key: string, label: string, num = false) => (
    <th key={key} className={num ? 'num' : ''} aria-sort={sort.key === key ? (sort.dir === 1 ? 'ascending' : 'descending') : 'none'}>
      <button type="button" className="uppercase hover:text-ink" onClick={() => setSort((s) => ({ key, dir: s.key === key ? (-s.dir as 1 | -1) : 1 }))}>
        {label}{sort.key === key ? (sort.dir === 1 ? ' ▲' : ' ▼') : ''}
      </button>
    </th>
  );

  return (
    <div className="space-y-3" data-parts-screen data-library-version={version}>
      <div className="flex flex-wrap items-center gap-2">
        <p className="text-sm text-muted">
          <strong className="text-ink">{library.name}</strong> · version {version} · prices in {library.currency}
          {library.demo && <span className="ml-1 rounded bg-warn-soft px-1.5 py-0.5 text-xs font-semibold text-warn">invented demo data</span>}
        </p>
        <span className="ml-auto flex flex-wrap gap-2">
          <a className="btn" href={`/api/v1/parts/export.csv?category=${tab.key}`} download>Export {tab.singular}s (CSV)</a>
          <a className="btn" href="/api/v1/parts/export.csv" download>Export whole library (CSV)</a>
          {canEdit && <button type="button" className="btn" onClick={() => { setImporting(true); setEditing(null); }}>Import CSV…</button>}
          {canEdit && <button type="button" className="btn btn-primary" onClick={() => { setEditing('new'); setImporting(false); }}>Add {tab.singular}</button>}
        </span>
      </div>
      {message && <p className={`text-sm ${message.error ? 'text-fail' : 'text-ok'}`} role={message.error ? 'alert' : 'status'} data-parts-message>{message.text}</p>}
      {importing && <ImportPanel onApplied={reload} onClose={() => setImporting(false)} />}
      {editing && (
        <PartForm key={editing === 'new' ? `new-${tab.key}` : editing.id} category={tab} part={editing === 'new' ? null : editing} currency={library.currency} baseVersion={version}
          onDone={reload} onCancel={() => setEditing(null)} />
      )}
      <div role="tablist" aria-label="Categories" className="flex flex-wrap gap-1 border-b border-line">
        {CATEGORIES.map((c) => (
          <button key={c.key} role="tab" type="button" aria-selected={c.key === tab.key} data-tab={c.key}
            className={`-mb-px rounded-t-md border px-3 py-1.5 text-sm ${c.key === tab.key ? 'border-line border-b-panel bg-panel font-semibold' : 'border-transparent text-muted hover:text-ink'}`}
            onClick={() => { setTab(c); setEditing(null); setSort({ key: ratingKey(c), dir: 1 }); }}>
            {c.label} <span className="text-xs text-muted">({(library[c.key] as unknown[]).length})</span>
          </button>
        ))}
      </div>
      <div className="flex flex-wrap items-end gap-3">
        <label className="w-72"><span className="label">Search</span><input className="field" type="search" value={query} onChange={(e) => setQuery(e.target.value)} placeholder="id, description or value" /></label>
        <label><span className="label">Status</span>
          <select className="field" value={status} onChange={(e) => setStatus(e.target.value)}>
            <option value="">All</option>
            {Object.entries(STATUS_LABELS).map(([k, v]) => <option key={k} value={k}>{v}</option>)}
          </select>
        </label>
        <p className="pb-1.5 text-sm text-muted" role="status">{shown.length} of {parts.length} shown</p>
      </div>
      <div className="card overflow-x-auto" role="tabpanel" aria-label={tab.label}>
        {shown.length === 0 ? (
          <p className="p-6 text-center text-sm text-muted">{parts.length === 0 ? `No ${tab.singular}s in the library yet.` : 'No part matches the search and filter.'}</p>
        ) : (
          <table className="table-eng" data-parts-table={tab.key}>
            <thead>
              <tr>
                {header('id', 'Id')}
                {header('status', 'Status')}
                {tab.fields.map((f) => header(f.key, f.label, f.kind === 'number'))}
                {header('price', `Unit price (${library.currency}) by qty`, true)}
                {canEdit && <th><span className="sr-only">Actions</span></th>}
              </tr>
            </thead>
            <tbody>
              {shown.map((p) => (
                <tr key={p.id} data-part={p.id} className={p.status === 'nfnd' ? 'text-muted' : ''}>
                  <td><span className="font-mono text-xs whitespace-nowrap">{p.id}</span>{typeof p.description === 'string' && <div className="text-xs text-muted">{p.description}</div>}</td>
                  <td><span className={`rounded px-1.5 py-0.5 text-xs font-semibold whitespace-nowrap ${STATUS_STYLE[p.status]}`}>{STATUS_LABELS[p.status]}</span></td>
                  {tab.fields.map((f) => <td key={f.key} className={f.kind === 'number' ? 'num' : ''} title={f.kind === 'number' ? `${String(p[f.key])} (SI)` : undefined}>{displayValue(p[f.key], f.unit)}</td>)}
                  <td className="num min-w-[11rem] text-xs !whitespace-normal">{p.tiers.map((t) => `${qtyText(t.minQty)}+: ${t.unitPrice.toFixed(3)}`).join(' · ')}</td>
                  {canEdit && (
                    <td className="whitespace-nowrap">
                      <button type="button" className="btn px-2 py-0.5" onClick={() => { setEditing(p); setImporting(false); }} aria-label={`Edit ${p.id}`}>Edit</button>{' '}
                      <button type="button" className="btn px-2 py-0.5" onClick={() => retire(p)} aria-label={`Retire ${p.id}`}>Retire</button>
                    </td>
                  )}
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </div>
      <p className="text-xs text-muted">
        Status: preferred and allowed parts may be chosen by the engine (cheapest qualifying part at the set's annual volume);
        parts marked not for new designs stay in the library for existing designs but are never picked automatically.
        {!canEdit && ' Only admins edit the library.'}
      </p>
    </div>
  );
}
