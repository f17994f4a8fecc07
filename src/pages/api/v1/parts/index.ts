import type { APIRoute } from 'astro';
import { getApp } from '../../../../lib/server/app';
import { authorize } from '../../../../lib/server/guard';
import { json, readJson } from '../../../../lib/server/http';
import { partCreateSchema } from '../../../../schemas/parts';
import { currentLibrary } from '../../../../features/parts/library.server';
import { addPart } from '../../../../features/parts/edit.server';
import { editReply } from '../../../../features/parts/replies.server';

/** The current parts library with its version number. Every role may read. */
export const GET: APIRoute = async ({ locals }) => {
  const user = authorize(locals, 'readParts');
  if (user instanceof Response) return user;
  const { db } = await getApp();
  const { library, version } = await currentLibrary(db);
  return json({ version, library });
};

/** `{category, part, baseVersion?}` → a new library version with the part added (admins). */
export const POST: APIRoute = async ({ locals, request }) => {
  const user = authorize(locals, 'editParts');
  if (user instanceof Response) return user;
  const body = await readJson(request, partCreateSchema);
  if (!body.ok) return body.response;
  const { db } = await getApp();
  return editReply(await addPart(db, user.id, body.data.category, body.data.part, body.data.baseVersion), 201);
};
