import type { APIRoute } from 'astro';
import { getApp } from '../../../../../lib/server/app';
import { authorize } from '../../../../../lib/server/guard';
import { fieldProblems, problem } from '../../../../../lib/server/http';
import { getSpec } from '../../../../../db/queries/specs';
import { specNetlist } from '../../../../../features/spice/netlist.server';
import { queryObject, specNetlistQuerySchema } from '../../../../../features/spice/query';

/** Plain ngspice-compatible netlist of one scheme of a saved requirement set (`?scheme=…&vin=min|nom|max`). */
export const GET: APIRoute = async ({ locals, params, url }) => {
  const user = authorize(locals, 'readSpecs');
  if (user instanceof Response) return user;
  const query = specNetlistQuerySchema.safeParse(queryObject(url));
  if (!query.success) return problem(400, 'Some query parameters are not valid.', fieldProblems(query.error));
  const { db } = await getApp();
  const spec = await getSpec(db, params.id ?? '');
  if (!spec) return problem(404, 'No requirement set with this id.');
  const outcome = await specNetlist(db, spec, query.data.scheme, query.data.vin);
  if (!outcome.ok) return problem(outcome.status, outcome.message);
  return new Response(outcome.text, {
    headers: { 'content-type': 'text/plain; charset=utf-8', 'content-disposition': `attachment; filename="${outcome.filename}"`, 'cache-control': 'no-store' },
  });
};
