import type { APIRoute } from 'astro';
import { getApp } from '../../../../../lib/server/app';
import { authorize } from '../../../../../lib/server/guard';
import { json, problem } from '../../../../../lib/server/http';
import { mayRead, shortlistView } from '../../../../../features/shortlists/view.server';

/** The shortlist with candidates, voters, history, and the tally when the caller may see it. */
export const GET: APIRoute = async ({ locals, params }) => {
  const user = authorize(locals, 'readSpecs');
  if (user instanceof Response) return user;
  const { db } = await getApp();
  const view = await shortlistView(db, params.id ?? '', user);
  if (!view) return problem(404, 'No shortlist with this id.');
  if (!mayRead(user, view.status)) return problem(403, 'Sales see decided shortlists only.');
  return json(view);
};
