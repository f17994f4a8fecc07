import type { APIRoute } from 'astro';
import { getApp } from '../../../../../lib/server/app';
import { authorize } from '../../../../../lib/server/guard';
import { json, readJson } from '../../../../../lib/server/http';
import { ballotSchema } from '../../../../../schemas/shortlists';
import { castBallot } from '../../../../../db/queries/shortlists';
import { ruled } from '../../../../../features/shortlists/http.server';

/** `{ranking, concerns, comment}`: casts or changes the caller's ballot (invited voters, while open). */
export const PUT: APIRoute = async ({ locals, params, request }) => {
  const user = authorize(locals, 'vote');
  if (user instanceof Response) return user;
  const body = await readJson(request, ballotSchema);
  if (!body.ok) return body.response;
  const { db } = await getApp();
  return ruled(async () => {
    const { changed } = await castBallot(db, params.id ?? '', user.id, body.data);
    return json({ recorded: true, changed }, changed ? 200 : 201);
  });
};
