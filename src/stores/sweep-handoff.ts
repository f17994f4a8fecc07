import { atom } from 'nanostores';
import { SCHEME_IDS, SCHEME_LABELS, type SchemeId } from '../engine/scheme-ids';
import { schemeOverrideSchema, type SchemeOverride } from '../schemas/spec';

/**
 * Hand-over of a Sweep point to Compare through the URL: `?overrides=<base64url JSON of
 * {scheme: override}>` and, when the point's switching frequency differs from the saved set,
 * `&fswHz=<Hz>`. Compare reads it once when it loads the saved set.
 */
export interface SweepHandoff {
  overrides: Partial<Record<SchemeId, SchemeOverride>>;
  fswHz: number | null;
}

/** The hand-over Compare applied, or the reason it refused one (for the note on Compare). */
export const $sweepHandoff = atom<{ applied: SweepHandoff | null; error: string | null }>({ applied: null, error: null });

function toBase64Url(text: string): string {
  const bytes = new TextEncoder().encode(text);
  let bin = '';
  for (const b of bytes) bin += String.fromCharCode(b);
  return btoa(bin).replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '');
}

function fromBase64Url(text: string): string {
  const bin = atob(text.replace(/-/g, '+').replace(/_/g, '/'));
  return new TextDecoder().decode(Uint8Array.from(bin, (c) => c.charCodeAt(0)));
}

/** Encodes per-scheme overrides for the URL. */
export function encodeOverrides(overrides: Partial<Record<SchemeId, SchemeOverride>>): string {
  return toBase64Url(JSON.stringify(overrides));
}

/** Decodes and validates `?overrides=` (each scheme's value with the shared override schema); a plain message when it is unusable. */
export function decodeOverrides(param: string): { ok: true; value: Partial<Record<SchemeId, SchemeOverride>> } | { ok: false; message: string } {
  let raw: unknown;
  try {
    raw = JSON.parse(fromBase64Url(param));
  } catch {
    return { ok: false, message: 'The sweep point in the address could not be read, so no overrides were applied.' };
  }
  if (raw === null || typeof raw !== 'object' || Array.isArray(raw)) return { ok: false, message: 'The sweep point in the address is not a set of scheme overrides.' };
  const value: Partial<Record<SchemeId, SchemeOverride>> = {};
  for (const [key, override] of Object.entries(raw)) {
    if (!(SCHEME_IDS as readonly string[]).includes(key)) return { ok: false, message: `The sweep point names an unknown scheme (${key.slice(0, 40)}).` };
    const parsed = schemeOverrideSchema.safeParse(override);
    if (!parsed.success) return { ok: false, message: `The sweep point for ${SCHEME_LABELS[key as SchemeId]} is not valid: ${parsed.error.issues.map((i) => `${i.path.join('.') || 'value'} ${i.message}`).join('; ')}.` };
    value[key as SchemeId] = parsed.data;
  }
  if (Object.keys(value).length === 0) return { ok: false, message: 'The sweep point in the address carries no overrides.' };
  return { ok: true, value };
}

/** Reads a hand-over from a query string; null when there is none. */
export function readHandoff(search: string): { ok: true; value: SweepHandoff } | { ok: false; message: string } | null {
  const params = new URLSearchParams(search);
  const param = params.get('overrides');
  if (param === null) return null;
  const decoded = decodeOverrides(param);
  if (!decoded.ok) return decoded;
  const fswText = params.get('fswHz');
  const fswHz = fswText === null ? null : Number(fswText);
  if (fswHz !== null && !(Number.isFinite(fswHz) && fswHz >= 10e3 && fswHz <= 5e6)) return { ok: false, message: 'The sweep point\'s switching frequency must lie between 10 kHz and 5 MHz.' };
  return { ok: true, value: { overrides: decoded.value, fswHz } };
}

/** Compare link for a sweep point. */
export function handoffHref(specId: string, scheme: SchemeId, override: SchemeOverride, fswHz: number | null): string {
  const q = new URLSearchParams({ overrides: encodeOverrides({ [scheme]: override }) });
  if (fswHz !== null) q.set('fswHz', String(fswHz));
  return `/compare/${encodeURIComponent(specId)}?${q.toString()}`;
}

/**
 * Applies a hand-over in the page's address to a saved set's requirements as they load on Compare
 * (its overrides replace those of the same scheme; its frequency replaces the saved one) and
 * records what was applied. Outside a browser, or without a hand-over, returns the input unchanged.
 */
export function withSweepHandoff(requirements: Record<string, unknown>): Record<string, unknown> {
  if (typeof window === 'undefined') return requirements;
  const read = readHandoff(window.location.search);
  if (read === null) return requirements;
  if (!read.ok) {
    $sweepHandoff.set({ applied: null, error: read.message });
    return requirements;
  }
  $sweepHandoff.set({ applied: read.value, error: null });
  const saved = (requirements.overrides ?? {}) as Record<string, unknown>;
  return {
    ...requirements,
    overrides: { ...saved, ...read.value.overrides },
    ...(read.value.fswHz !== null ? { fswHz: read.value.fswHz } : {}),
  };
}
