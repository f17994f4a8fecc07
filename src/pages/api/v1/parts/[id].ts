import type { APIRoute } from 'astro';
import { z } from 'zod';
import { getApp } from '../../../../lib/server/app';
import { authorize } from '../../../../lib/server/guard';
import { fieldProblems, problem, readJson } from '../../../../lib/server/http';
import { partUpdateSchema } from '../../../../schemas/parts';
import { retirePart, updatePart } from '../../../../features/parts/edit.server';
import { editReply } from '../../../../features/parts/replies.server';

/** `{part, baseVersion?}` → a new library version with the part's fields replaced (admins). */
export const PUT: APIRoute = async ({ locals, params, request }) => {
  const user = authorize(locals, 'editParts');
  if (user instanceof Response) return user;
  const body = await readJson(request, partUpdateSchema);
  if (!body.ok) return body.response;
  const { db } = await getApp();
  return editReply(await updatePart(db, user.id, params.id ?? '', body.data.part, body.data.baseVersion));
};

const retireQuery = z.strictObject({ baseVersion: z.coerce.number().int().min(1, { error: 'baseVersion must be at least 1' }).optional() });

/** Retires (removes) a part from the library; earlier versions keep it (admins). */
export const DELETE: APIRoute = async ({ locals, params, url }) => {
  const user = authorize(locals, 'editParts');
  if (user instanceof Response) return user;
  const query = retireQuery.safeParse(Object.fromEntries(url.searchParams));
  if (!query.success) return problem(400, 'Some query parameters are not valid.', fieldProblems(query.error));
  const { db } = await getApp();
  return editReply(await retirePart(db, user.id, params.id ?? '', query.data.baseVersion));
};
