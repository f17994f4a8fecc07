import type { APIRoute } from 'astro';
import { ENGINE_VERSION, evaluate } from '../../../../../engine';
import { getApp } from '../../../../../lib/server/app';
import { authorize } from '../../../../../lib/server/guard';
import { json, problem } from '../../../../../lib/server/http';
import { getSpec } from '../../../../../db/queries/specs';
import { currentLibrary } from '../../../../../features/parts/library.server';
import { storedLibraryVersion } from '../../../../../features/parts/library-version';

/**
 * The server's comparison for the saved version. Stored at save time; a set saved under an
 * older engine (or seeded without one) is evaluated afresh and says so. When the parts library
 * changed since the stored result, the stored one is returned with `libraryChanged: true`;
 * `?fresh=1` re-evaluates it against the current library (nothing is saved).
 */
export const GET: APIRoute = async ({ locals, params, url }) => {
  const user = authorize(locals, 'readSpecs');
  if (user instanceof Response) return user;
  const { db } = await getApp();
  const spec = await getSpec(db, params.id ?? '');
  if (!spec) return problem(404, 'No requirement set with this id.');
  const { library, version } = await currentLibrary(db);
  const storedLibrary = storedLibraryVersion(spec.comparison);
  const engineCurrent = spec.comparison !== null && spec.engineVersion === ENGINE_VERSION;
  const useStored = engineCurrent && url.searchParams.get('fresh') !== '1';
  const libraryChanged = useStored && storedLibrary !== String(version);
  return json({
    specId: spec.id,
    specVersion: spec.version,
    evaluatedAt: useStored ? spec.evaluatedAt?.toISOString() ?? null : new Date().toISOString(),
    storedEngineVersion: spec.engineVersion,
    reevaluated: !useStored,
    libraryVersion: version,
    storedLibraryVersion: storedLibrary,
    libraryChanged,
    ...(libraryChanged ? { notice: `Parts library changed since this result (computed with version ${storedLibrary ?? 'unknown'}, now version ${version}).` } : {}),
    comparison: useStored ? spec.comparison : evaluate(spec.requirements, library),
  });
};
