import { parseSpecInput, type NormalisedSpec } from '../../../src/schemas/spec';

/** Normalise a requirement set for tests; throws with the schema's messages if invalid. */
export function spec(raw: Record<string, unknown>): NormalisedSpec {
  const p = parseSpecInput(raw);
  if (!p.ok) throw new Error(p.errors.map((e) => e.message).join('; '));
  return p.value;
}

/** Invented test specs (not customer data). */
export const TELECOM = { vinMinV: 36, vinNomV: 48, vinMaxV: 75, voutV: 12, ioutA: 12.5, fswHz: 250e3, rectifier: 'synchronous' };
export const SERVER = { vinMinV: 300, vinNomV: 390, vinMaxV: 410, voutV: 12, ioutA: 41.7, fswHz: 130e3, rectifier: 'synchronous' };
export const INDUSTRIAL = { vinMinV: 18, vinNomV: 24, vinMaxV: 32, voutV: 5, ioutA: 10, fswHz: 200e3 };
