import type { PartsLibrary } from '../../engine';
import { $saved, loadSpec } from '../../stores/saved';
import { loadLibrary } from '../../stores/library';
import type { SpecPayload } from '../../lib/api-client';

/** What the server stored for a saved set, to tell when the parts library moved on since. */
export interface StoredResult {
  /** Library version the stored comparison used ("3"), or null when unknown. */
  libraryVersion: string | null;
  evaluatedAt: string | null;
  results: { scheme: string; label: string; feasible: boolean; bomCost: number; efficiency: number; mainSwitchId: string | null }[];
}

export interface CompareInitial {
  spec: SpecPayload | null;
  requirements: Record<string, unknown>;
  /** The current parts library (its `version` is the database version number). */
  library: PartsLibrary;
  /** The saved comparison's summary, when the set has one. */
  stored?: StoredResult | null;
}

/** Id of the one JSON element CompareScreen.astro writes the page's data into. */
export const COMPARE_INITIAL_ID = 'compare-initial';

let cached: CompareInitial | undefined;

/**
 * The page's requirement set, parts library and stored result, written once into the page
 * (not into every island's props: the library alone is most of the page).
 */
export function compareInitial(): CompareInitial {
  if (!cached) {
    const element = document.getElementById(COMPARE_INITIAL_ID);
    if (!element?.textContent) throw new Error(`#${COMPARE_INITIAL_ID} is missing from the page`);
    cached = JSON.parse(element.textContent) as CompareInitial;
  }
  return cached;
}

let loaded = false;

/** Loads the page's requirement set and parts library into the stores once, whichever island mounts first. */
export function ensureLoaded(): void {
  if (loaded || $saved.get().snapshot !== '') return;
  loaded = true;
  const initial = compareInitial();
  loadLibrary(initial.library);
  loadSpec(initial.spec, initial.requirements);
}
