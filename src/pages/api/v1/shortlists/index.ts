import type { APIRoute } from 'astro';
import { getApp } from '../../../../lib/server/app';
import { authorize } from '../../../../lib/server/guard';
import { fieldProblems, json, problem, readJson } from '../../../../lib/server/http';
import { shortlistCreateSchema, shortlistListQuerySchema } from '../../../../schemas/shortlists';
import { createShortlist, listShortlists } from '../../../../db/queries/shortlists';
import { ruled } from '../../../../features/shortlists/http.server';

/** Shortlists (`?specId=` for one spec); sales see decided ones only. */
export const GET: APIRoute = async ({ locals, url }) => {
  const user = authorize(locals, 'readSpecs');
  if (user instanceof Response) return user;
  const query = shortlistListQuerySchema.safeParse(Object.fromEntries(url.searchParams));
  if (!query.success) return problem(400, 'Some query parameters are not valid.', fieldProblems(query.error));
  const { db } = await getApp();
  const rows = await listShortlists(db, { specId: query.data.specId, decidedOnly: user.role === 'sales' });
  return json({
    shortlists: rows.map((r) => ({ ...r, deadline: r.deadline?.toISOString() ?? null, updatedAt: r.updatedAt.toISOString() })),
  });
};

/** `{specId, title}` → a draft shortlist owned by the caller (architects and admins). */
export const POST: APIRoute = async ({ locals, request }) => {
  const user = authorize(locals, 'editSpecs');
  if (user instanceof Response) return user;
  const body = await readJson(request, shortlistCreateSchema);
  if (!body.ok) return body.response;
  const { db } = await getApp();
  return ruled(async () => {
    const id = await createShortlist(db, body.data, user.id);
    return json({ id, status: 'draft', ...body.data }, 201, { location: `/api/v1/shortlists/${id}` });
  });
};
