import { evaluate, type SchemeId } from '../../src/engine';
import type { SnapshotWrite } from '../../src/db/queries/shortlists';
import { demoSpecs } from '../../src/demo/specs';

/** A real frozen result of one scheme of the first demo set, for tests about the shortlist workflow around it. */
export function frozenSnapshot(scheme: SchemeId): SnapshotWrite {
  const comparison = evaluate({ ...demoSpecs[0]!.requirements, schemes: [scheme] });
  return { result: comparison.results[0]!, input: comparison.input, engineVersion: 'test', specVersion: 1, partsLibraryVersion: null };
}
