import { atom, map } from 'nanostores';
import { CHOICE_FIELDS, NUMERIC_FIELDS, fieldText, type FieldKey } from '../lib/spec-fields';
import { markEdit } from '../lib/perf';

/** What the user typed in each requirement field (text, parsed by $evaluation). */
export const $draftFields = map<Record<FieldKey, string>>({} as Record<FieldKey, string>);
/** Name and customer of the set being edited. */
export const $draftMeta = map<{ name: string; customer: string }>({ name: '', customer: '' });
/** Requirements the form does not show (schemes, overrides…) are carried through unchanged. */
export const $draftExtras = atom<Record<string, unknown>>({});

const SHOWN = new Set<string>([...NUMERIC_FIELDS.map((f) => f.key), ...CHOICE_FIELDS.map((f) => f.key), 'weights', 'overrides']);

/** Fills the form from stored requirements (SI values). */
export function loadDraft(requirements: Record<string, unknown>, meta: { name: string; customer: string }): void {
  const fields = {} as Record<FieldKey, string>;
  for (const field of NUMERIC_FIELDS) fields[field.key] = fieldText(field, requirements[field.key]);
  for (const field of CHOICE_FIELDS) fields[field.key] = String(requirements[field.key] ?? field.options[0]!.value);
  $draftFields.set(fields);
  $draftMeta.set({ ...meta });
  $draftExtras.set(Object.fromEntries(Object.entries(requirements).filter(([key]) => !SHOWN.has(key))));
}

export function setDraftField(key: FieldKey, text: string): void {
  markEdit();
  $draftFields.setKey(key, text);
}

export function setDraftMeta(key: 'name' | 'customer', text: string): void {
  $draftMeta.setKey(key, text);
}
