import type { SchemeId } from './scheme-ids';
import { activeClamp } from './schemes/active-clamp';
import { rcdClamp } from './schemes/rcd-clamp';
import { resonantReset } from './schemes/resonant-reset';
import { tertiaryWinding } from './schemes/tertiary-winding';
import { twoSwitch } from './schemes/two-switch';
import type { ResetSchemeModel } from './schemes/types';

/** Scheme id → model. A new scheme: one module, one line here, one id in scheme-ids.ts, one test table. */
export const SCHEME_REGISTRY: Readonly<Record<SchemeId, ResetSchemeModel>> = {
  'tertiary-winding': tertiaryWinding,
  'rcd-clamp': rcdClamp,
  'active-clamp': activeClamp,
  'two-switch': twoSwitch,
  'resonant-reset': resonantReset,
};

/** The model of a scheme id; RangeError for an unknown id. */
export function schemeModel(id: string): ResetSchemeModel {
  const m = (SCHEME_REGISTRY as Record<string, ResetSchemeModel | undefined>)[id];
  if (!m) throw new RangeError(`unknown reset scheme "${id}"; known: ${Object.keys(SCHEME_REGISTRY).join(', ')}`);
  return m;
}
