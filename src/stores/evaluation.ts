import { computed } from 'nanostores';
import { evaluateNormalised, type Comparison } from '../engine';
import { parseSpecInput } from '../schemas/spec';
import { parseQuantity } from '../lib/units';
import { CHOICE_FIELDS, NUMERIC_FIELDS } from '../lib/spec-fields';
import { $draftExtras, $draftFields } from './spec-draft';
import { $overrides } from './overrides';
import { $weights } from './weights';
import { $library } from './library';

export interface Evaluation {
  /** The latest valid comparison (kept while the form has errors). */
  comparison: Comparison | null;
  /** The requirement set as the API takes it, when the form is valid. */
  requirements: Record<string, unknown> | null;
  /** Plain messages per field (form field key, or `weights`). */
  errors: Record<string, string>;
  /** False while `comparison` belongs to an earlier, valid state of the form. */
  current: boolean;
}

/** Turns the form text into a requirement set: unit errors first, then the shared schema. */
export function buildRequirements(fields: Record<string, string>, extras: Record<string, unknown>): { raw: Record<string, unknown>; errors: Record<string, string> } {
  const raw: Record<string, unknown> = { ...extras };
  const errors: Record<string, string> = {};
  for (const field of NUMERIC_FIELDS) {
    const text = fields[field.key] ?? '';
    if (text.trim() === '' && !field.required) continue;
    const parsed = parseQuantity(text, field.kind);
    if (parsed.ok) raw[field.key] = parsed.value;
    else errors[field.key] = parsed.message;
  }
  for (const field of CHOICE_FIELDS) if (fields[field.key]) raw[field.key] = fields[field.key];
  return { raw, errors };
}

let lastValid: Comparison | null = null;

/** The live comparison every card and chart renders, recomputed on any edit, against the workspace's parts library. */
export const $evaluation = computed([$draftFields, $draftExtras, $weights, $overrides, $library], (fields, extras, weights, overrides, library): Evaluation => {
  if (Object.keys(fields).length === 0 || !library) return { comparison: null, requirements: null, errors: {}, current: false };
  const { raw, errors } = buildRequirements(fields, extras);
  raw.weights = weights;
  if (Object.keys(overrides).length > 0) raw.overrides = overrides;
  if (Object.keys(errors).length === 0) {
    const parsed = parseSpecInput(raw);
    if (parsed.ok) {
      lastValid = evaluateNormalised(parsed.value, library);
      return { comparison: lastValid, requirements: raw, errors, current: true };
    }
    for (const error of parsed.errors) errors[error.field.split('.')[0]!] ??= error.message;
  }
  return { comparison: lastValid, requirements: null, errors, current: false };
});
