import type { APIRoute } from 'astro';
import { getApp } from '../../../../../lib/server/app';
import { authorize } from '../../../../../lib/server/guard';
import { json, problem, readJson } from '../../../../../lib/server/http';
import { specUpdateSchema } from '../../../../../schemas/specs-api';
import { archiveSpec, getSpec, updateSpec } from '../../../../../db/queries/specs';
import { checkRequirements } from '../../../../../features/specs/requirements';
import { evaluateForStorage } from '../../../../../features/specs/evaluate.server';
import { toSpecJson } from '../../../../../features/specs/spec-json';

export const GET: APIRoute = async ({ locals, params }) => {
  const user = authorize(locals, 'readSpecs');
  if (user instanceof Response) return user;
  const { db } = await getApp();
  const spec = await getSpec(db, params.id ?? '');
  if (!spec) return problem(404, 'No requirement set with this id.');
  return json(toSpecJson(spec));
};

/**
 * `{version, name, customer, requirements}`: saves a new version and the server's evaluation.
 * A `version` other than the current one is 409 with who saved the newer one.
 */
export const PUT: APIRoute = async ({ locals, params, request }) => {
  const user = authorize(locals, 'editSpecs');
  if (user instanceof Response) return user;
  const body = await readJson(request, specUpdateSchema);
  if (!body.ok) return body.response;
  const requirements = checkRequirements(body.data.requirements);
  if (!requirements.ok) return problem(400, 'Some fields are not valid.', requirements.errors);
  const { db } = await getApp();
  const id = params.id ?? '';
  const outcome = await updateSpec(db, id, body.data.version, await evaluateForStorage(db, body.data.name, body.data.customer, requirements.value), user.id);
  if (outcome.kind === 'missing') return problem(404, 'No active requirement set with this id.');
  if (outcome.kind === 'stale') {
    const who = outcome.updatedByName ?? 'someone';
    return json(
      {
        error: `${who} saved version ${outcome.currentVersion} at ${outcome.updatedAt.toISOString()} after you loaded version ${body.data.version}. Reload to see it, or save again with version ${outcome.currentVersion} to overwrite it.`,
        currentVersion: outcome.currentVersion,
        updatedBy: outcome.updatedByName,
        updatedAt: outcome.updatedAt.toISOString(),
      },
      409,
    );
  }
  return json(toSpecJson((await getSpec(db, id))!));
};

/** Archives the set: it leaves the lists but stays readable and in the audit trail. */
export const DELETE: APIRoute = async ({ locals, params }) => {
  const user = authorize(locals, 'editSpecs');
  if (user instanceof Response) return user;
  const { db } = await getApp();
  if (!(await archiveSpec(db, params.id ?? '', user.id))) return problem(404, 'No active requirement set with this id.');
  return json({ archived: true });
};
