import { useStore } from '@nanostores/react';
import { memo, useId } from 'react';
import { $draftFields, $draftMeta, setDraftField, setDraftMeta } from '../../stores/spec-draft';
import { $evaluation } from '../../stores/evaluation';
import { parseQuantity } from '../../lib/units';
import { CHOICE_FIELDS, NUMERIC_FIELDS, fieldText, type NumericField } from '../../lib/spec-fields';
import { ensureLoaded } from './init';

interface Props {
  /** Form editable (what-if) — false for read-only roles. */
  editable: boolean;
  /** Name and customer are shown for saved sets. */
  showMeta: boolean;
}

const GROUPS = [
  { id: 'electrical', title: 'Electrical' },
  { id: 'targets', title: 'Targets' },
  { id: 'design', title: 'Design assumptions' },
] as const;

/** One field; memoised, so an edit re-renders only the field that changed (and any whose note changed). */
const NumericInput = memo(function NumericInput({ field, text, error, editable }: { field: NumericField; text: string; error?: string; editable: boolean }) {
  const id = useId();
  const parsed = text.trim() === '' ? null : parseQuantity(text, field.kind);
  const shown = parsed?.ok ? fieldText(field, parsed.value) : null;
  return (
    <div className="grid grid-cols-[9.5rem_1fr] items-start gap-x-2 py-1">
      <label htmlFor={id} className="pt-1.5 text-sm">
        {field.label}
        {field.required && <span className="text-muted" aria-hidden="true"> *</span>}
      </label>
      <div>
        <input
          id={id} name={field.key} className="field font-medium tabular-nums" value={text} readOnly={!editable} spellCheck={false}
          autoComplete="off" inputMode="text" required={field.required}
          onChange={(e) => setDraftField(field.key, e.target.value)}
          aria-invalid={error ? true : undefined} aria-describedby={`${id}-note`}
        />
        <p id={`${id}-note`} className={`mt-0.5 min-h-4 text-xs ${error ? 'text-fail' : 'text-muted'}`} data-field-note={field.key}>
          {error ?? (shown && shown !== text.trim() ? `= ${shown}` : field.hint)}
        </p>
      </div>
    </div>
  );
});

/** The requirement-set form: unit-aware inputs, parsed values shown, errors from the shared schema. */
export default function SpecForm({ editable, showMeta }: Props) {
  ensureLoaded();
  const fields = useStore($draftFields);
  const meta = useStore($draftMeta);
  const { errors } = useStore($evaluation);
  const errorCount = Object.keys(errors).length;
  return (
    <form className="card p-4" onSubmit={(e) => e.preventDefault()} aria-labelledby="spec-form-title" data-spec-form>
      <div className="mb-2 flex items-baseline justify-between">
        <h2 id="spec-form-title" className="font-semibold">Requirement set</h2>
        {!editable && <span className="rounded bg-canvas px-1.5 py-0.5 text-xs text-muted">read-only</span>}
      </div>
      {showMeta && (
        <div className="mb-2 space-y-1 border-b border-line pb-3">
          {(['name', 'customer'] as const).map((key) => (
            <div key={key} className="grid grid-cols-[9.5rem_1fr] items-center gap-x-2">
              <label htmlFor={`meta-${key}`} className="text-sm">{key === 'name' ? 'Name' : 'Customer'}</label>
              <input id={`meta-${key}`} className="field" value={meta[key]} readOnly={!editable} onChange={(e) => setDraftMeta(key, e.target.value)} />
            </div>
          ))}
        </div>
      )}
      {errorCount > 0 && (
        <p role="alert" className="mb-2 rounded-md border border-fail/30 bg-fail-soft px-3 py-1.5 text-sm text-fail">
          {errorCount === 1 ? 'One field needs attention' : `${errorCount} fields need attention`}; the cards show the last valid result.
        </p>
      )}
      {GROUPS.map((group) => (
        <fieldset key={group.id} className="border-b border-line py-2 last:border-b-0">
          <legend className="label pt-1">{group.title}</legend>
          {NUMERIC_FIELDS.filter((f) => f.group === group.id).map((field) => (
            <NumericInput key={field.key} field={field} text={fields[field.key] ?? ''} error={errors[field.key]} editable={editable} />
          ))}
          {group.id === 'design' && CHOICE_FIELDS.map((field) => (
            <div key={field.key} className="grid grid-cols-[9.5rem_1fr] items-center gap-x-2 py-1">
              <label htmlFor={`choice-${field.key}`} className="text-sm">{field.label}</label>
              <select
                id={`choice-${field.key}`} className="field" value={fields[field.key] ?? ''} disabled={!editable}
                onChange={(e) => setDraftField(field.key, e.target.value)}
              >
                {field.options.map((o) => <option key={o.value} value={o.value}>{o.label}</option>)}
              </select>
            </div>
          ))}
        </fieldset>
      ))}
      {errors.weights && <p className="text-sm text-fail">{errors.weights}</p>}
    </form>
  );
}
