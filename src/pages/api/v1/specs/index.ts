import type { APIRoute } from 'astro';
import { getApp } from '../../../../lib/server/app';
import { authorize } from '../../../../lib/server/guard';
import { fieldProblems, json, problem, readJson } from '../../../../lib/server/http';
import { specCreateSchema, specListQuerySchema } from '../../../../schemas/specs-api';
import { createSpec, getSpec, listSpecSummaries } from '../../../../db/queries/specs';
import { checkRequirements } from '../../../../features/specs/requirements';
import { evaluateForStorage } from '../../../../features/specs/evaluate.server';
import { toSpecJson } from '../../../../features/specs/spec-json';

/** Requirement sets (`?archived=1` includes archived ones). Every role may read. */
export const GET: APIRoute = async ({ locals, url }) => {
  const user = authorize(locals, 'readSpecs');
  if (user instanceof Response) return user;
  const query = specListQuerySchema.safeParse(Object.fromEntries(url.searchParams));
  if (!query.success) return problem(400, 'Some query parameters are not valid.', fieldProblems(query.error));
  const { db } = await getApp();
  const rows = await listSpecSummaries(db, { includeArchived: query.data.archived === '1' });
  return json({ specs: rows.map(toSpecJson) });
};

/** `{name, customer, requirements}` → the new set, evaluated by the server (architects and admins). */
export const POST: APIRoute = async ({ locals, request }) => {
  const user = authorize(locals, 'editSpecs');
  if (user instanceof Response) return user;
  const body = await readJson(request, specCreateSchema);
  if (!body.ok) return body.response;
  const requirements = checkRequirements(body.data.requirements);
  if (!requirements.ok) return problem(400, 'Some fields are not valid.', requirements.errors);
  const { db } = await getApp();
  const id = await createSpec(db, await evaluateForStorage(db, body.data.name, body.data.customer, requirements.value), user.id);
  const created = await getSpec(db, id);
  return json(toSpecJson(created!), 201, { location: `/api/v1/specs/${id}` });
};
