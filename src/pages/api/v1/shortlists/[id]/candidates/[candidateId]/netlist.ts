import type { APIRoute } from 'astro';
import { getApp } from '../../../../../../../lib/server/app';
import { authorize } from '../../../../../../../lib/server/guard';
import { fieldProblems, problem } from '../../../../../../../lib/server/http';
import { getShortlist, loadShortlistParts } from '../../../../../../../db/queries/shortlists';
import { getSpec } from '../../../../../../../db/queries/specs';
import { mayRead } from '../../../../../../../features/shortlists/view.server';
import { candidateNetlist } from '../../../../../../../features/spice/netlist.server';
import { candidateNetlistQuerySchema, queryObject } from '../../../../../../../features/spice/query';
import { SCHEME_IDS } from '../../../../../../../engine';

/** Netlist of a shortlist candidate from its newest frozen snapshot (`?vin=min|nom|max`). */
export const GET: APIRoute = async ({ locals, params, url }) => {
  const user = authorize(locals, 'readSpecs');
  if (user instanceof Response) return user;
  const query = candidateNetlistQuerySchema.safeParse(queryObject(url));
  if (!query.success) return problem(400, 'Some query parameters are not valid.', fieldProblems(query.error));
  const { db } = await getApp();
  const shortlist = await getShortlist(db, params.id ?? '');
  if (!shortlist) return problem(404, 'No shortlist with this id.');
  if (!mayRead(user, shortlist.status)) return problem(403, 'Sales see decided shortlists only.');
  const parts = await loadShortlistParts(db, shortlist.id);
  const candidate = parts.live.find((c) => c.id === params.candidateId);
  if (!candidate || !(SCHEME_IDS as readonly string[]).includes(candidate.scheme)) return problem(404, 'No such candidate on this shortlist.');
  const snapshot = parts.snapshots.filter((s) => s.candidateId === candidate.id).at(-1);
  if (!snapshot) return problem(404, 'This candidate has no frozen result yet.');
  const spec = await getSpec(db, shortlist.specId);
  const outcome = await candidateNetlist(db, `${spec?.name ?? 'spec'} - ${shortlist.title}`, candidate.scheme, snapshot.input, snapshot.partsLibraryVersion, query.data.vin);
  if (!outcome.ok) return problem(outcome.status, outcome.message);
  return new Response(outcome.text, {
    headers: { 'content-type': 'text/plain; charset=utf-8', 'content-disposition': `attachment; filename="${outcome.filename}"`, 'cache-control': 'no-store' },
  });
};
