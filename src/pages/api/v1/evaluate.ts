import type { APIRoute } from 'astro';
import { z } from 'zod';
import { evaluateNormalised } from '../../../engine';
import { authorize } from '../../../lib/server/guard';
import { json, problem, readJson } from '../../../lib/server/http';
import { parseSpecInput } from '../../../schemas/spec';

/** A requirement set in, the comparison out: the same output as `npm run evaluate`. */
export const POST: APIRoute = async ({ locals, request }) => {
  const user = authorize(locals);
  if (user instanceof Response) return user;
  const body = await readJson(request, z.unknown());
  if (!body.ok) return body.response;
  const parsed = parseSpecInput(body.data);
  if (!parsed.ok) return problem(400, 'Some fields are not valid.', parsed.errors);
  return json(evaluateNormalised(parsed.value));
};
