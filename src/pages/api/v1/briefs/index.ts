import type { APIRoute } from 'astro';
import { getApp } from '../../../../lib/server/app';
import { config } from '../../../../lib/server/config';
import { authorize } from '../../../../lib/server/guard';
import { fieldProblems, json, problem, readJson } from '../../../../lib/server/http';
import { briefCreateSchema, briefDraftSchema, briefListQuerySchema } from '../../../../schemas/briefs';
import { createBrief, getShortlistForBrief, listBriefs } from '../../../../db/queries/briefs';
import { getSpec } from '../../../../db/queries/specs';
import { loadBrief } from '../../../../features/briefs/service.server';
import { toBriefJson, toBriefSummaryJson } from '../../../../features/briefs/brief-json';

/** Briefs, newest change first; `?specId=` narrows to one requirement set. Every role may read. */
export const GET: APIRoute = async ({ locals, url }) => {
  const user = authorize(locals, 'readBriefs');
  if (user instanceof Response) return user;
  const query = briefListQuerySchema.safeParse(Object.fromEntries(url.searchParams));
  if (!query.success) return problem(400, 'Some query parameters are not valid.', fieldProblems(query.error));
  const { db } = await getApp();
  const rows = await listBriefs(db, { specId: query.data.specId });
  return json({ briefs: rows.map(toBriefSummaryJson) });
};

/** `{specId, shortlistId?, title?, customerName?, customerContact?}` → a new draft brief (sales, architects, admins). */
export const POST: APIRoute = async ({ locals, request }) => {
  const user = authorize(locals, 'writeBriefs');
  if (user instanceof Response) return user;
  const body = await readJson(request, briefCreateSchema);
  if (!body.ok) return body.response;
  const { db } = await getApp();
  const spec = await getSpec(db, body.data.specId);
  if (!spec) return problem(400, 'Some fields are not valid.', [{ field: 'specId', message: 'no requirement set has this id' }]);
  if (spec.archivedAt) return problem(400, 'Some fields are not valid.', [{ field: 'specId', message: 'this requirement set is archived; restore or duplicate it first' }]);
  if (body.data.shortlistId) {
    const shortlist = await getShortlistForBrief(db, body.data.shortlistId);
    if (!shortlist || shortlist.specId !== spec.id) {
      return problem(400, 'Some fields are not valid.', [{ field: 'shortlistId', message: 'no shortlist of this requirement set has this id' }]);
    }
  }
  const customerName = body.data.customerName ?? spec.customer.trim();
  if (!customerName) return problem(400, 'Some fields are not valid.', [{ field: 'customerName', message: 'customerName is required (the requirement set names no customer)' }]);
  const id = await createBrief(db, {
    specId: spec.id,
    shortlistId: body.data.shortlistId ?? null,
    title: body.data.title ?? `Feasibility brief: ${spec.name}`,
    customerName,
    customerContact: body.data.customerContact ?? '',
    draft: briefDraftSchema.parse({}),
  }, user.id);
  const loaded = await loadBrief(db, id, { demo: config.demo });
  return json(toBriefJson(loaded!.brief, loaded!.draft, loaded!.content, loaded!.versions), 201, { location: `/api/v1/briefs/${id}` });
};
