import type { APIRoute } from 'astro';
import { getApp } from '../../../../../lib/server/app';
import { authorize } from '../../../../../lib/server/guard';
import { json, readJson } from '../../../../../lib/server/http';
import { emptyBodySchema } from '../../../../../schemas/shortlists';
import { withdrawShortlist } from '../../../../../db/queries/shortlists';
import { ruled } from '../../../../../features/shortlists/http.server';

/** Withdraws a shortlist that will not be decided (owner). */
export const POST: APIRoute = async ({ locals, params, request }) => {
  const user = authorize(locals, 'editSpecs');
  if (user instanceof Response) return user;
  const body = await readJson(request, emptyBodySchema);
  if (!body.ok) return body.response;
  const { db } = await getApp();
  return ruled(async () => {
    await withdrawShortlist(db, params.id ?? '', user);
    return json({ status: 'withdrawn' });
  });
};
