import { parseSpecInput, type NormalisedSpec, type SpecError, type SpecInput } from '../../schemas/spec';

/**
 * The stored form of a requirement set: the normalised input (defaults filled, so a saved
 * set means the same thing after defaults change) without null placeholders, so it parses
 * again with the same schema.
 */
export function toStoredRequirements(spec: NormalisedSpec): SpecInput {
  const stored: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(spec)) {
    if (value === null || value === undefined) continue;
    if (key === 'overrides' && Object.keys(value as object).length === 0) continue;
    stored[key] = value;
  }
  return stored as SpecInput;
}

/** Validates requirements with the shared schema; errors are named `requirements.<field>`. */
export function checkRequirements(raw: unknown): { ok: true; value: NormalisedSpec } | { ok: false; errors: SpecError[] } {
  const parsed = parseSpecInput(raw);
  if (parsed.ok) return parsed;
  return { ok: false, errors: parsed.errors.map((e) => ({ field: `requirements.${e.field}`, message: e.message })) };
}
