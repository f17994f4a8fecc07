import { useStore } from '@nanostores/react';
import { $dirty, $saved, createSpecFromDraft, reloadSpec, saveSpec } from '../../stores/saved';
import { $evaluation } from '../../stores/evaluation';
import { $draftMeta } from '../../stores/spec-draft';
import { ensureLoaded } from './init';

function download(name: string, type: string, text: string): void {
  const url = URL.createObjectURL(new Blob([text], { type }));
  const link = document.createElement('a');
  link.href = url;
  link.download = name;
  link.click();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

const fileStem = (name: string): string => (name.trim() || 'comparison').replace(/[^\w.-]+/g, '-').replace(/-+/g, '-').slice(0, 60);

/** Saved/unsaved state, save with version check, conflict choices, and exports. */
export default function SaveBar({ canSave }: { canSave: boolean }) {
  ensureLoaded();
  const saved = useStore($saved);
  const dirty = useStore($dirty);
  const { comparison, requirements } = useStore($evaluation);
  const meta = useStore($draftMeta);
  const stem = fileStem(meta.name);
  // Those who may not save (engineers, sales) are trying values: say so, rather than "unsaved", which asks for a save.
  const changed = canSave || !saved.specId ? 'Unsaved changes' : `Trying values · saved version ${saved.version} unchanged`;
  const state = saved.status === 'saving' ? 'Saving…' : saved.status === 'conflict' ? 'Conflict' : dirty ? changed : saved.specId ? `Saved · version ${saved.version}` : 'Not saved (scratch comparison)';
  return (
    <div className="card flex flex-wrap items-center gap-2 px-3 py-2" data-save-bar>
      <span
        className={`text-sm font-medium ${dirty || saved.status === 'conflict' ? 'text-warn' : 'text-muted'}`}
        role="status" aria-live="polite" data-save-state={saved.status === 'conflict' ? 'conflict' : dirty ? 'unsaved' : 'saved'}
      >
        {state}
      </span>
      {saved.message && saved.status !== 'conflict' && (
        <span className={`text-sm ${saved.status === 'error' ? 'text-fail' : 'text-ok'}`}>{saved.message}</span>
      )}
      <span className="ml-auto flex flex-wrap gap-2">
        {canSave && saved.specId && (
          <button type="button" className="btn btn-primary" disabled={!dirty || !requirements || saved.status === 'saving'} onClick={() => saveSpec()}>
            Save
          </button>
        )}
        {canSave && !saved.specId && (
          <button type="button" className="btn btn-primary" disabled={!requirements || !meta.name.trim() || saved.status === 'saving'} onClick={() => createSpecFromDraft()}>
            Save as new requirement set
          </button>
        )}
        <button
          type="button" className="btn" disabled={!comparison}
          onClick={async () => {
            if (!comparison) return;
            const { comparisonCsv } = await import('../../lib/comparison-csv'); // papaparse only when exporting
            download(`${stem}.csv`, 'text/csv', comparisonCsv(comparison));
          }}
        >
          Export CSV
        </button>
        <button type="button" className="btn" disabled={!comparison} onClick={() => comparison && download(`${stem}.json`, 'application/json', `${JSON.stringify(comparison, null, 2)}\n`)}>
          Export JSON
        </button>
      </span>
      {saved.status === 'conflict' && (
        <div role="alert" className="basis-full rounded-md border border-warn/40 bg-warn-soft px-3 py-2 text-sm">
          <p>{saved.message}</p>
          <div className="mt-2 flex gap-2">
            <button type="button" className="btn" onClick={() => reloadSpec()}>Reload their version (drops your edits)</button>
            <button type="button" className="btn" onClick={() => saveSpec(true)}>Overwrite with mine</button>
          </div>
        </div>
      )}
    </div>
  );
}
