import type { APIRoute } from 'astro';
import { getApp } from '../../../../../../../lib/server/app';
import { authorize } from '../../../../../../../lib/server/guard';
import { json, problem, readJson } from '../../../../../../../lib/server/http';
import { emptyBodySchema } from '../../../../../../../schemas/shortlists';
import { addSnapshot, getShortlist, loadShortlistParts } from '../../../../../../../db/queries/shortlists';
import { getSpec } from '../../../../../../../db/queries/specs';
import { freezeCandidate } from '../../../../../../../features/shortlists/snapshot.server';
import { ruled } from '../../../../../../../features/shortlists/http.server';

/** A new snapshot from the current spec and engine; the earlier ones are kept (owner, draft). */
export const POST: APIRoute = async ({ locals, params, request }) => {
  const user = authorize(locals, 'editSpecs');
  if (user instanceof Response) return user;
  const body = await readJson(request, emptyBodySchema);
  if (!body.ok) return body.response;
  const { db } = await getApp();
  const shortlist = await getShortlist(db, params.id ?? '');
  if (!shortlist) return problem(404, 'No shortlist with this id.');
  const candidate = (await loadShortlistParts(db, shortlist.id)).live.find((c) => c.id === params.candidateId);
  if (!candidate) return problem(404, 'No such candidate on this shortlist.');
  const spec = await getSpec(db, shortlist.specId);
  if (!spec) return problem(404, 'The shortlist\'s requirement set is missing.');
  const snapshot = freezeCandidate(spec, candidate.scheme, candidate.overrides);
  return ruled(async () => {
    await addSnapshot(db, shortlist.id, candidate.id, snapshot, user);
    return json({ reevaluated: true, engineVersion: snapshot.engineVersion, specVersion: snapshot.specVersion });
  });
};
