import type { APIRoute } from 'astro';
import { getApp } from '../../../../../lib/server/app';
import { authorize } from '../../../../../lib/server/guard';
import { json, readJson } from '../../../../../lib/server/http';
import { emptyBodySchema } from '../../../../../schemas/shortlists';
import { closeVoting } from '../../../../../db/queries/shortlists';
import { ruled } from '../../../../../features/shortlists/http.server';

/** Closes voting (owner); the tally becomes visible to everyone who may read the shortlist. */
export const POST: APIRoute = async ({ locals, params, request }) => {
  const user = authorize(locals, 'editSpecs');
  if (user instanceof Response) return user;
  const body = await readJson(request, emptyBodySchema);
  if (!body.ok) return body.response;
  const { db } = await getApp();
  return ruled(async () => {
    await closeVoting(db, params.id ?? '', user);
    return json({ status: 'closed' });
  });
};
