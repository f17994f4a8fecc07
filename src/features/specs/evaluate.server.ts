import { ENGINE_VERSION, evaluateNormalised, type Comparison } from '../../engine';
import type { NormalisedSpec } from '../../schemas/spec';
import type { SpecWrite } from '../../db/queries/specs';
import { toStoredRequirements } from './requirements';

/** The server's own evaluation, stored with every save (the browser's is only a preview). */
export function evaluateForStorage(name: string, customer: string, spec: NormalisedSpec): SpecWrite {
  const comparison: Comparison = evaluateNormalised(spec);
  return {
    name,
    customer,
    requirements: toStoredRequirements(spec) as Record<string, unknown>,
    comparison: comparison as unknown as Record<string, unknown>,
    engineVersion: ENGINE_VERSION,
  };
}
