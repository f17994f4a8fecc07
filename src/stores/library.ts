import { atom } from 'nanostores';
import type { PartsLibrary } from '../engine';

/**
 * The workspace's current parts library for in-browser evaluation, sent by the server in the
 * page props (never bundled); null until the page's islands load it.
 */
export const $library = atom<PartsLibrary | null>(null);

export function loadLibrary(library: PartsLibrary): void {
  if ($library.get() !== library) $library.set(library);
}
