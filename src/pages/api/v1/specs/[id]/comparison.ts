import type { APIRoute } from 'astro';
import { ENGINE_VERSION, evaluate } from '../../../../../engine';
import { getApp } from '../../../../../lib/server/app';
import { authorize } from '../../../../../lib/server/guard';
import { json, problem } from '../../../../../lib/server/http';
import { getSpec } from '../../../../../db/queries/specs';

/**
 * The server's comparison for the saved version. Stored at save time; a set saved under an
 * older engine (or seeded without one) is evaluated afresh and says so.
 */
export const GET: APIRoute = async ({ locals, params }) => {
  const user = authorize(locals, 'readSpecs');
  if (user instanceof Response) return user;
  const { db } = await getApp();
  const spec = await getSpec(db, params.id ?? '');
  if (!spec) return problem(404, 'No requirement set with this id.');
  const current = spec.comparison && spec.engineVersion === ENGINE_VERSION;
  return json({
    specId: spec.id,
    specVersion: spec.version,
    evaluatedAt: current ? spec.evaluatedAt?.toISOString() ?? null : new Date().toISOString(),
    storedEngineVersion: spec.engineVersion,
    reevaluated: !current,
    comparison: current ? spec.comparison : evaluate(spec.requirements),
  });
};
