import { ENGINE_VERSION, evaluateNormalised, type Comparison } from '../../engine';
import type { Db } from '../../db/client';
import type { NormalisedSpec } from '../../schemas/spec';
import type { SpecWrite } from '../../db/queries/specs';
import { currentLibrary } from '../parts/library.server';
import { toStoredRequirements } from './requirements';

/**
 * The server's own evaluation against the workspace's current parts library, stored with every
 * save (the browser's is only a preview); the comparison records the library version it used.
 */
export async function evaluateForStorage(db: Db, name: string, customer: string, spec: NormalisedSpec): Promise<SpecWrite> {
  const { library } = await currentLibrary(db);
  const comparison: Comparison = evaluateNormalised(spec, library);
  return {
    name,
    customer,
    requirements: toStoredRequirements(spec),
    comparison,
    engineVersion: ENGINE_VERSION,
  };
}
