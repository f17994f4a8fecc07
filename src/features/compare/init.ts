import { $saved, loadSpec } from '../../stores/saved';
import type { SpecPayload } from './api';

export interface CompareInitial {
  spec: SpecPayload | null;
  requirements: Record<string, unknown>;
}

let loaded = false;

/** Loads the page's requirement set into the stores once, whichever island mounts first. */
export function ensureLoaded(initial: CompareInitial): void {
  if (loaded || $saved.get().snapshot !== '') return;
  loaded = true;
  loadSpec(initial.spec, initial.requirements);
}
