import type { APIRoute } from 'astro';
import { getApp } from '../../../../../lib/server/app';
import { config } from '../../../../../lib/server/config';
import { authorize } from '../../../../../lib/server/guard';
import { json, problem, readJson } from '../../../../../lib/server/http';
import { briefUpdateSchema } from '../../../../../schemas/briefs';
import { updateBrief } from '../../../../../db/queries/briefs';
import { loadBrief } from '../../../../../features/briefs/service.server';
import { toBriefJson } from '../../../../../features/briefs/brief-json';

/** One brief: draft, live preview and every frozen version (every role may read). */
export const GET: APIRoute = async ({ locals, params }) => {
  const user = authorize(locals, 'readBriefs');
  if (user instanceof Response) return user;
  const { db } = await getApp();
  const loaded = await loadBrief(db, params.id ?? '', { demo: config.demo });
  if (!loaded) return problem(404, 'No brief with this id.');
  return json(toBriefJson(loaded.brief, loaded.draft, loaded.content, loaded.versions));
};

/**
 * Saves the editable brief (title, customer, summary, recommended scheme, contingency, extra
 * risks and assumptions). A recommended scheme must be feasible for the requirement set.
 */
export const PUT: APIRoute = async ({ locals, params, request }) => {
  const user = authorize(locals, 'writeBriefs');
  if (user instanceof Response) return user;
  const body = await readJson(request, briefUpdateSchema);
  if (!body.ok) return body.response;
  const { db } = await getApp();
  const id = params.id ?? '';
  const before = await loadBrief(db, id, { demo: config.demo });
  if (!before) return problem(404, 'No brief with this id.');
  const { title, customerName, customerContact, ...draft } = body.data;
  if (draft.recommendedScheme !== null) {
    const result = before.comparison.results.find((r) => r.scheme === draft.recommendedScheme);
    if (!result?.feasible) {
      return problem(400, 'Some fields are not valid.', [{ field: 'recommendedScheme', message: `${result?.label ?? draft.recommendedScheme} is not feasible for this requirement set; recommend a feasible or marginal scheme` }]);
    }
  }
  await updateBrief(db, id, { title, customerName, customerContact, draft }, user.id);
  const loaded = await loadBrief(db, id, { demo: config.demo });
  return json(toBriefJson(loaded!.brief, loaded!.draft, loaded!.content, loaded!.versions));
};
