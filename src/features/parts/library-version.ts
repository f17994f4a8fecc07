import type { Comparison } from '../../engine/result-types';
/** The parts-library version a stored comparison was computed with ("7"), or null. Both sides. */
export function storedLibraryVersion(comparison: Pick<Comparison, 'partsLibrary'> | null | undefined): string | null {
  // Comparisons stored before the library was versioned have none.
  const version: unknown = comparison?.partsLibrary?.version;
  return typeof version === 'string' ? version : null;
}
