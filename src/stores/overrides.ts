import { atom } from 'nanostores';
import type { SchemeId } from '../engine/scheme-ids';
import type { SchemeOverride } from '../schemas/spec';

/** Per-scheme design overrides (turns ratio, duty limit, parts), e.g. a point picked on Sweep. */
export const $overrides = atom<Partial<Record<SchemeId, SchemeOverride>>>({});

export function loadOverrides(overrides: Partial<Record<SchemeId, SchemeOverride>> | undefined): void {
  $overrides.set({ ...(overrides ?? {}) });
}
