import type { APIRoute } from 'astro';
import { z } from 'zod';
import { evaluateNormalised } from '../../../engine';
import { getApp } from '../../../lib/server/app';
import { authorize } from '../../../lib/server/guard';
import { json, problem, readJson } from '../../../lib/server/http';
import { parseSpecInput } from '../../../schemas/spec';
import { currentLibrary } from '../../../features/parts/library.server';

/** A requirement set in, the comparison out against the workspace's current parts library. */
export const POST: APIRoute = async ({ locals, request }) => {
  const user = authorize(locals, 'runComparisons');
  if (user instanceof Response) return user;
  const body = await readJson(request, z.unknown());
  if (!body.ok) return body.response;
  const parsed = parseSpecInput(body.data);
  if (!parsed.ok) return problem(400, 'Some fields are not valid.', parsed.errors);
  const { db } = await getApp();
  const { library } = await currentLibrary(db);
  return json(evaluateNormalised(parsed.value, library));
};
