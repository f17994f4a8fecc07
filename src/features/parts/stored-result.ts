import type { Comparison } from '../../engine/result-types';
import type { StoredResult } from '../compare/init';
import { storedLibraryVersion } from './library-version';

/** A short summary of a stored comparison for the Compare page (null when none was stored). */
export function storedResultOf(comparison: Comparison | null, evaluatedAt: Date | null): StoredResult | null {
  if (!comparison) return null;
  const results = comparison.results.map((r) => ({
    scheme: r.scheme,
    label: r.label,
    feasible: r.feasible,
    bomCost: r.bomCost,
    efficiency: r.efficiency,
    mainSwitchId: r.details.mainSwitchId,
  }));
  return { libraryVersion: storedLibraryVersion(comparison), evaluatedAt: evaluatedAt?.toISOString() ?? null, results };
}
