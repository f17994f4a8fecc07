import type { APIRoute } from 'astro';
import { getApp } from '../../../../../../lib/server/app';
import { authorize } from '../../../../../../lib/server/guard';
import { json, problem, readJson } from '../../../../../../lib/server/http';
import { candidateCreateSchema } from '../../../../../../schemas/shortlists';
import { addCandidate, getShortlist } from '../../../../../../db/queries/shortlists';
import { getSpec } from '../../../../../../db/queries/specs';
import { freezeCandidate } from '../../../../../../features/shortlists/snapshot.server';
import { ruled } from '../../../../../../features/shortlists/http.server';

/** `{scheme, overrides?, note?}` → a candidate frozen from the saved spec (draft shortlists). */
export const POST: APIRoute = async ({ locals, params, request }) => {
  const user = authorize(locals, 'vote');
  if (user instanceof Response) return user;
  const body = await readJson(request, candidateCreateSchema);
  if (!body.ok) return body.response;
  const { db } = await getApp();
  const shortlist = await getShortlist(db, params.id ?? '');
  if (!shortlist) return problem(404, 'No shortlist with this id.');
  const spec = await getSpec(db, shortlist.specId);
  if (!spec) return problem(404, 'The shortlist\'s requirement set is missing.');
  const overrides = (body.data.overrides ?? {}) as Record<string, unknown>;
  const snapshot = freezeCandidate(spec, body.data.scheme, overrides);
  return ruled(async () => {
    const id = await addCandidate(db, shortlist.id, { scheme: body.data.scheme, overrides, note: body.data.note }, snapshot, user.id);
    return json({ id, scheme: body.data.scheme, note: body.data.note, overrides, engineVersion: snapshot.engineVersion, specVersion: snapshot.specVersion, result: snapshot.result }, 201);
  });
};
