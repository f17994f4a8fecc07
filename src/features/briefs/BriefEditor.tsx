import { useId } from 'react';
import { VERDICT_LABELS } from '../../lib/verdict';
import type { BriefVerdict } from '../../schemas/brief-content';

export interface EditorForm {
  title: string;
  customerName: string;
  customerContact: string;
  summary: string;
  /** '' = the engine's (or the decided shortlist's) choice. */
  recommendedScheme: string;
  contingencyLowPct: string;
  contingencyHighPct: string;
  risksText: string;
  assumptionsText: string;
}

interface Props {
  form: EditorForm;
  onChange(change: Partial<EditorForm>): void;
  onSave(): void;
  onResetSummary(): void;
  verdicts: BriefVerdict[];
  defaultLabel: string;
  busy: boolean;
  dirty: boolean;
  fieldError(name: string): string | undefined;
}

function Field({ label, error, children, hint }: { label: string; error?: string | undefined; hint?: string; children: (id: string, describedBy: string | undefined) => React.ReactNode }) {
  const id = useId();
  const describedBy = error ? `${id}-error` : hint ? `${id}-hint` : undefined;
  return (
    <div>
      <label htmlFor={id} className="label">{label}</label>
      {children(id, describedBy)}
      {hint && !error && <p id={`${id}-hint`} className="mt-1 text-xs text-muted">{hint}</p>}
      {error && <p id={`${id}-error`} className="mt-1 text-xs text-fail">{error}</p>}
    </div>
  );
}

/** The editable parts of a brief; the document beside it shows the result after each save. */
export default function BriefEditor({ form, onChange, onSave, onResetSummary, verdicts, defaultLabel, busy, dirty, fieldError }: Props) {
  const text = (key: keyof EditorForm) => ({
    value: form[key],
    onChange: (e: { target: { value: string } }) => onChange({ [key]: e.target.value }),
    'aria-invalid': fieldError(key) ? true : undefined,
  });
  return (
    <form className="space-y-3" onSubmit={(e) => { e.preventDefault(); onSave(); }} data-brief-editor>
      <Field label="Title" error={fieldError('title')}>{(id, d) => <input id={id} aria-describedby={d} className="field" {...text('title')} required />}</Field>
      <div className="grid grid-cols-2 gap-2">
        <Field label="Customer" error={fieldError('customerName')}>{(id, d) => <input id={id} aria-describedby={d} className="field" {...text('customerName')} required />}</Field>
        <Field label="Contact" error={fieldError('customerContact')}>{(id, d) => <input id={id} aria-describedby={d} className="field" {...text('customerContact')} placeholder="name, e-mail" />}</Field>
      </div>
      <Field label="Recommended scheme" error={fieldError('recommendedScheme')}>
        {(id, d) => (
          <select id={id} aria-describedby={d} className="field" {...text('recommendedScheme')}>
            <option value="">{defaultLabel}</option>
            {verdicts.filter((v) => v.verdict !== 'not-feasible').map((v) => (
              <option key={v.scheme} value={v.scheme}>{v.label} ({VERDICT_LABELS[v.verdict].toLowerCase()})</option>
            ))}
          </select>
        )}
      </Field>
      <div className="grid grid-cols-2 gap-2">
        <Field label="Contingency below, %" error={fieldError('contingencyLowPct')}>
          {(id, d) => <input id={id} aria-describedby={d} className="field" type="number" min={0} max={90} step={1} inputMode="decimal" {...text('contingencyLowPct')} />}
        </Field>
        <Field label="Contingency above, %" error={fieldError('contingencyHighPct')}>
          {(id, d) => <input id={id} aria-describedby={d} className="field" type="number" min={0} max={300} step={1} inputMode="decimal" {...text('contingencyHighPct')} />}
        </Field>
      </div>
      <Field label="Summary" error={fieldError('summary')} hint="What the customer reads first. Blank lines start new paragraphs.">
        {(id, d) => <textarea id={id} aria-describedby={d} className="field min-h-40" {...text('summary')} />}
      </Field>
      <button type="button" className="btn text-xs" onClick={onResetSummary}>Use the generated summary</button>
      <Field label="Further risks" error={fieldError('risksText')} hint="One per line; listed after the engine's findings.">
        {(id, d) => <textarea id={id} aria-describedby={d} className="field min-h-20" {...text('risksText')} />}
      </Field>
      <Field label="Further assumptions" error={fieldError('assumptionsText')} hint="One per line.">
        {(id, d) => <textarea id={id} aria-describedby={d} className="field min-h-20" {...text('assumptionsText')} />}
      </Field>
      <div className="flex items-center gap-2">
        <button type="submit" className="btn btn-primary" disabled={busy || !dirty}>{busy ? 'Saving…' : 'Save draft'}</button>
        <span className="text-xs text-muted" aria-live="polite">{dirty ? 'Unsaved changes' : 'Saved'}</span>
      </div>
    </form>
  );
}
