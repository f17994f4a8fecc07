import type { StoredResult } from '../compare/init';
import { storedLibraryVersion } from './library-version';

/** A short summary of a stored comparison for the Compare page (null when none was stored). */
export function storedResultOf(comparison: Record<string, unknown> | null, evaluatedAt: Date | null): StoredResult | null {
  if (!comparison || !Array.isArray(comparison.results)) return null;
  const results = (comparison.results as Record<string, unknown>[]).map((r) => ({
    scheme: String(r.scheme),
    label: String(r.label ?? r.scheme),
    feasible: r.feasible === true,
    bomCost: Number(r.bomCost),
    efficiency: Number(r.efficiency),
    mainSwitchId: ((r.details as Record<string, unknown> | undefined)?.mainSwitchId as string | null | undefined) ?? null,
  }));
  return { libraryVersion: storedLibraryVersion(comparison), evaluatedAt: evaluatedAt?.toISOString() ?? null, results };
}
