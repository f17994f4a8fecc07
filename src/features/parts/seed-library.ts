import { demoPartsLibrary } from '../../engine/parts/demo-library';
import type { StoredLibrary } from '../../engine/parts/types';

/** Name of the invented demo library as the workspace shows it. */
export const DEMO_LIBRARY_NAME = 'Halvard demo parts (invented)';

/**
 * Version 1 of a workspace's library: the engine's built-in invented demo parts, stored without
 * the engine's own version string (the database version number stands in for it).
 */
export function seedLibraryJson(): StoredLibrary {
  const { version: _engineVersion, ...rest } = demoPartsLibrary;
  return {
    ...structuredClone(rest),
    name: DEMO_LIBRARY_NAME,
    note: 'Demo data of the fictional Halvard Power Systems: every part, value and price is invented for illustration. No manufacturer or real part number.',
  };
}

export const SEED_SUMMARY = 'Seeded from the built-in demo library (invented parts and prices)';
