import type { APIRoute } from 'astro';
import { getApp } from '../../../../../lib/server/app';
import { authorize } from '../../../../../lib/server/guard';
import { json, readJson } from '../../../../../lib/server/http';
import { decisionSchema } from '../../../../../schemas/shortlists';
import { recordDecision } from '../../../../../db/queries/shortlists';
import { ruled } from '../../../../../features/shortlists/http.server';

/** `{candidateId, rationale}` after close (owner); the shortlist becomes read-only. */
export const POST: APIRoute = async ({ locals, params, request }) => {
  const user = authorize(locals, 'editSpecs');
  if (user instanceof Response) return user;
  const body = await readJson(request, decisionSchema);
  if (!body.ok) return body.response;
  const { db } = await getApp();
  return ruled(async () => {
    await recordDecision(db, params.id ?? '', body.data, user);
    return json({ status: 'decided', candidateId: body.data.candidateId });
  });
};
