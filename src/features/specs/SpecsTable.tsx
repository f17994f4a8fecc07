import { useMemo, useState } from 'react';
import { api } from '../../lib/api-client';
import type { SpecRow } from './spec-row';

/** A row as the page hands it over (the hazard flag stays on the server). */
export type SpecListRow = Omit<SpecRow, 'maxInputV'>;

type SortKey = 'name' | 'customer' | 'owner' | 'updated';

interface Props {
  rows: SpecListRow[];
  canEdit: boolean;
}

const HEADERS: { key: SortKey | null; label: string; num?: boolean }[] = [
  { key: 'name', label: 'Requirement set' },
  { key: 'customer', label: 'Customer' },
  { key: null, label: 'Input', num: true },
  { key: null, label: 'Output', num: true },
  { key: null, label: 'Power', num: true },
  { key: null, label: 'Switching', num: true },
  { key: 'owner', label: 'Owner' },
  { key: 'updated', label: 'Updated', num: true },
];

/** The Specs list: rendered on the server, filtered and sorted in the browser. */
export default function SpecsTable({ rows: initialRows, canEdit }: Props) {
  const [rows, setRows] = useState(initialRows);
  const [query, setQuery] = useState('');
  const [sort, setSort] = useState<{ key: SortKey; dir: 1 | -1 }>({ key: 'updated', dir: -1 });
  const [message, setMessage] = useState<{ text: string; error: boolean } | null>(null);
  const [busy, setBusy] = useState<string | null>(null);

  const shown = useMemo(() => {
    const q = query.trim().toLowerCase();
    const filtered = q ? rows.filter((r) => `${r.name} ${r.customer} ${r.owner}`.toLowerCase().includes(q)) : rows;
    return [...filtered].sort((a, b) => a[sort.key].localeCompare(b[sort.key]) * sort.dir);
  }, [rows, query, sort]);

  async function duplicate(row: SpecListRow) {
    setBusy(row.id);
    const result = await api<{ id: string }>('POST', '/api/v1/specs', { name: `${row.name} (copy)`.slice(0, 160), customer: row.customer === '—' ? '' : row.customer, requirements: row.requirements });
    setBusy(null);
    if (result.ok) window.location.assign(`/compare/${encodeURIComponent(result.data.id)}`);
    else setMessage({ text: result.problem.error, error: true });
  }

  async function archive(row: SpecListRow) {
    if (!window.confirm(`Archive "${row.name}"? It leaves this list; its history is kept.`)) return;
    setBusy(row.id);
    const result = await api('DELETE', `/api/v1/specs/${encodeURIComponent(row.id)}`);
    setBusy(null);
    if (result.ok) {
      setRows((list) => list.filter((r) => r.id !== row.id));
      setMessage({ text: `"${row.name}" archived.`, error: false });
    } else setMessage({ text: result.problem.error, error: true });
  }

  const toggleSort = (key: SortKey) => setSort((s) => (s.key === key ? { key, dir: s.dir === 1 ? -1 : 1 } : { key, dir: key === 'updated' ? -1 : 1 }));

  return (
    <section className="card" aria-labelledby="specs-list-title">
      <div className="flex flex-wrap items-center gap-3 border-b border-line px-4 py-3">
        <h2 id="specs-list-title" className="font-semibold">Requirement sets</h2>
        <label className="sr-only" htmlFor="spec-filter">Filter</label>
        <input
          id="spec-filter" type="search" className="field max-w-xs" placeholder="Filter by name, customer or owner"
          value={query} onChange={(e) => setQuery(e.target.value)}
        />
        <span className="text-sm text-muted" aria-live="polite">{shown.length} of {rows.length}</span>
        {message && <span role="status" className={`text-sm ${message.error ? 'text-fail' : 'text-ok'}`}>{message.text}</span>}
      </div>
      {rows.length === 0 ? (
        <p className="px-4 py-8 text-center text-sm text-muted" data-empty>
          No requirement sets yet.{canEdit ? ' Create the first one with "New requirement set".' : ' An architect creates them.'}
        </p>
      ) : shown.length === 0 ? (
        <p className="px-4 py-8 text-center text-sm text-muted">Nothing matches "{query}".</p>
      ) : (
        <div className="overflow-x-auto">
          <table className="table-eng" data-spec-table>
            <thead>
              <tr>
                {HEADERS.map((h) => (
                  <th key={h.label} scope="col" className={h.num ? 'num' : ''} aria-sort={h.key && sort.key === h.key ? (sort.dir === 1 ? 'ascending' : 'descending') : undefined}>
                    {h.key ? (
                      <button type="button" className="uppercase hover:text-ink" onClick={() => toggleSort(h.key!)}>
                        {h.label}{sort.key === h.key ? (sort.dir === 1 ? ' ▲' : ' ▼') : ''}
                      </button>
                    ) : h.label}
                  </th>
                ))}
                {canEdit && <th scope="col"><span className="sr-only">Actions</span></th>}
              </tr>
            </thead>
            <tbody>
              {shown.map((row) => (
                <tr key={row.id} data-spec-row={row.id}>
                  <td className="font-medium">
                    <a href={`/compare/${encodeURIComponent(row.id)}`} className="text-accent hover:underline">{row.name}</a>
                    <span className="ml-1 text-xs text-muted">v{row.version}</span>
                    {row.archived && <span className="ml-1 rounded bg-canvas px-1 text-xs text-muted">archived</span>}
                  </td>
                  <td>{row.customer}</td>
                  <td className="num">{row.input}</td>
                  <td className="num">{row.output}</td>
                  <td className="num">{row.power}</td>
                  <td className="num">{row.switching}</td>
                  <td>{row.owner}</td>
                  <td className="num"><time dateTime={row.updated}>{row.updated.slice(0, 10)}</time></td>
                  {canEdit && (
                    <td className="whitespace-nowrap text-right">
                      <button type="button" className="btn py-0.5 text-xs" disabled={busy === row.id} onClick={() => duplicate(row)} aria-label={`Duplicate ${row.name}`}>Duplicate</button>{' '}
                      {!row.archived && <button type="button" className="btn py-0.5 text-xs" disabled={busy === row.id} onClick={() => archive(row)} aria-label={`Archive ${row.name}`}>Archive</button>}
                    </td>
                  )}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
