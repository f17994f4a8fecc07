import type { APIRoute } from 'astro';
import { getApp } from '../../../../../../../lib/server/app';
import { authorize } from '../../../../../../../lib/server/guard';
import { json } from '../../../../../../../lib/server/http';
import { removeCandidate } from '../../../../../../../db/queries/shortlists';
import { ruled } from '../../../../../../../features/shortlists/http.server';

/** Removes a candidate while the shortlist is a draft (its owner). */
export const DELETE: APIRoute = async ({ locals, params }) => {
  const user = authorize(locals, 'editSpecs');
  if (user instanceof Response) return user;
  const { db } = await getApp();
  return ruled(async () => {
    await removeCandidate(db, params.id ?? '', params.candidateId ?? '', user);
    return json({ removed: true });
  });
};
