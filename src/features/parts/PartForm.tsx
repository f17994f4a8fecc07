import { useState } from 'react';
import { api } from '../../lib/api-client';
import { MAX_TIERS, PART_STATUSES, STATUS_LABELS, type CategoryInfo } from './categories';
import { parseSiValue, SMALL_UNITS, valueText } from './si-input';

type Part = Record<string, unknown>;

interface Props {
  category: CategoryInfo;
  /** The part being edited, or null to add one. */
  part: Part | null;
  currency: string;
  baseVersion: number;
  onDone: (message: string) => void;
  onCancel: () => void;
}

const tiersText = (part: Part | null): { qty: string; price: string }[] =>
  ((part?.tiers as { minQty: number; unitPrice: number }[] | undefined) ?? [{ minQty: 1, unitPrice: Number.NaN }]).map((t) => ({ qty: String(t.minQty), price: Number.isFinite(t.unitPrice) ? String(t.unitPrice) : '' }));

/** Add or edit one part (admins). Values take SI prefixes; the server checks everything again. */
export default function PartForm({ category, part, currency, baseVersion, onDone, onCancel }: Props) {
  const [texts, setTexts] = useState<Record<string, string>>(() => {
    const t: Record<string, string> = { id: String(part?.id ?? ''), description: String(part?.description ?? ''), status: String(part?.status ?? 'preferred') };
    for (const f of category.fields) t[f.key] = f.kind === 'number' ? valueText(part?.[f.key], f.unit ?? '') : String(part?.[f.key] ?? f.options?.[0] ?? '');
    return t;
  });
  const [tiers, setTiers] = useState(() => tiersText(part));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [busy, setBusy] = useState(false);
  const [failure, setFailure] = useState('');
  const set = (key: string, value: string) => setTexts((t) => ({ ...t, [key]: value }));

  async function submit(event: React.SyntheticEvent) {
    event.preventDefault();
    const found: Record<string, string> = {};
    const body: Part = { id: texts.id!.trim(), status: texts.status };
    if (texts.description!.trim()) body.description = texts.description!.trim();
    for (const f of category.fields) {
      const text = texts[f.key] ?? '';
      if (f.kind !== 'number') { body[f.key] = text.trim(); continue; }
      const parsed = parseSiValue(text, f.unit ?? '');
      if (parsed.ok) body[f.key] = parsed.value;
      else found[f.key] = parsed.message;
    }
    body.tiers = tiers.filter((t) => t.qty.trim() || t.price.trim()).map((t, i) => {
      const minQty = Number(t.qty);
      const unitPrice = Number(t.price.replace(',', '.'));
      if (!t.qty.trim() || !Number.isInteger(minQty)) found[`tiers.${i}`] = 'quantity must be a whole number';
      else if (!t.price.trim() || !Number.isFinite(unitPrice)) found[`tiers.${i}`] = 'price must be a number';
      return { minQty, unitPrice };
    });
    setErrors(found);
    if (Object.keys(found).length > 0) return;
    setBusy(true);
    setFailure('');
    const result = part
      ? await api<{ version: number }>('PUT', `/api/v1/parts/${encodeURIComponent(String(part.id))}`, { part: body, baseVersion })
      : await api<{ version: number }>('POST', '/api/v1/parts', { category: category.key, part: body, baseVersion });
    setBusy(false);
    if (result.ok) return onDone(part ? `Saved ${body.id} as library version ${result.data.version}.` : `Added ${body.id} as library version ${result.data.version}.`);
    const server: Record<string, string> = {};
    for (const f of result.problem.fields ?? []) server[f.field.replace(/^part\./, '')] = f.message;
    setErrors(server);
    setFailure(result.problem.error);
  }

  const field = (key: string, label: string, input: React.ReactNode, hint?: string) => (
    <label className="block" key={key}>
      <span className="label">{label}</span>
      {input}
      {errors[key] ? <span className="mt-0.5 block text-xs text-fail" id={`err-${key}`}>{errors[key]}</span> : hint ? <span className="mt-0.5 block text-xs text-muted">{hint}</span> : null}
    </label>
  );
  const textInput = (key: string, extra: Record<string, unknown> = {}) => (
    <input className="field" value={texts[key] ?? ''} onChange={(e) => set(key, e.target.value)} aria-invalid={errors[key] ? true : undefined} aria-describedby={errors[key] ? `err-${key}` : undefined} {...extra} />
  );

  return (
    <form className="card space-y-3 p-4" onSubmit={submit} noValidate data-part-form aria-labelledby="part-form-title">
      <h2 id="part-form-title" className="font-semibold">{part ? `Edit ${category.singular} ${String(part.id)}` : `Add a ${category.singular}`}</h2>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        {field('id', 'Id', textInput('id', { readOnly: part !== null, autoFocus: part === null, placeholder: 'e.g. halvard-nmos-650v-b' }), part ? 'the id stays; retire and add to rename' : 'letters, digits, . _ -')}
        {field('status', 'Status', (
          <select className="field" value={texts.status} onChange={(e) => set('status', e.target.value)}>
            {PART_STATUSES.map((s) => <option key={s} value={s}>{STATUS_LABELS[s]}</option>)}
          </select>
        ))}
        <div className="sm:col-span-2">{field('description', 'Description (optional)', textInput('description', { maxLength: 200 }))}</div>
        {category.fields.map((f) => field(f.key, `${f.label}${f.kind === 'number' && f.unit ? ` (${SMALL_UNITS[f.unit]?.unit ?? f.unit})` : ''}`, f.kind === 'choice' ? (
          <select className="field" value={texts[f.key]} onChange={(e) => set(f.key, e.target.value)}>
            {f.options!.map((o) => <option key={o} value={o}>{o}</option>)}
          </select>
        ) : textInput(f.key, { inputMode: f.kind === 'number' ? 'decimal' : 'text' }), f.hint))}
      </div>
      <fieldset>
        <legend className="label">Unit price by annual quantity ({currency})</legend>
        <div className="flex flex-wrap gap-2">
          {tiers.map((t, i) => (
            <div key={i} className="flex items-center gap-1 rounded-md border border-line p-1.5">
              <label className="text-xs text-muted">from <input className="field inline-block w-24" aria-label={`tier ${i + 1} quantity`} inputMode="numeric" value={t.qty} onChange={(e) => setTiers((all) => all.map((x, j) => (j === i ? { ...x, qty: e.target.value } : x)))} /> pcs</label>
              <label className="text-xs text-muted"><input className="field inline-block w-20" aria-label={`tier ${i + 1} unit price`} inputMode="decimal" value={t.price} onChange={(e) => setTiers((all) => all.map((x, j) => (j === i ? { ...x, price: e.target.value } : x)))} /> {currency}</label>
              {tiers.length > 1 && <button type="button" className="btn px-2 py-0.5" aria-label={`remove tier ${i + 1}`} onClick={() => setTiers((all) => all.filter((_, j) => j !== i))}>×</button>}
              {errors[`tiers.${i}`] && <span className="text-xs text-fail">{errors[`tiers.${i}`]}</span>}
            </div>
          ))}
          {tiers.length < MAX_TIERS && <button type="button" className="btn" onClick={() => setTiers((all) => [...all, { qty: '', price: '' }])}>Add tier</button>}
        </div>
        {errors.tiers && <p className="mt-1 text-xs text-fail">{errors.tiers}</p>}
      </fieldset>
      {failure && <p className="text-sm text-fail" role="alert">{failure}</p>}
      <div className="flex gap-2">
        <button type="submit" className="btn btn-primary" disabled={busy}>{busy ? 'Saving…' : part ? 'Save part' : 'Add part'}</button>
        <button type="button" className="btn" onClick={onCancel}>Cancel</button>
      </div>
    </form>
  );
}
