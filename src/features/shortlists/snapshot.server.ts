import { ENGINE_VERSION, evaluateNormalised, parseSpecInput, type PartsLibrary, type SchemeId } from '../../engine';
import type { SpecDetail } from '../../db/queries/specs';
import type { SnapshotWrite } from '../../db/queries/shortlists';

/**
 * Freezes one scheme of a saved spec: the server evaluates the saved requirements with the
 * candidate's overrides, and the snapshot records engine, spec and parts-library versions.
 */
export function freezeCandidate(spec: SpecDetail, scheme: SchemeId, overrides: Record<string, unknown>, library?: PartsLibrary): SnapshotWrite {
  const requirements = { ...spec.requirements, schemes: [scheme], overrides: Object.keys(overrides).length > 0 ? { [scheme]: overrides } : undefined };
  const parsed = parseSpecInput(JSON.parse(JSON.stringify(requirements)));
  if (!parsed.ok) throw new RangeError(`the saved requirement set does not validate: ${parsed.errors.map((e) => e.message).join('; ')}`);
  const comparison = evaluateNormalised(parsed.value, library);
  return {
    result: comparison.results[0]!,
    input: comparison.input,
    engineVersion: ENGINE_VERSION,
    specVersion: spec.version,
    partsLibraryVersion: comparison.partsLibrary.version,
  };
}
