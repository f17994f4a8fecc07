import type { APIRoute } from 'astro';
import { getApp } from '../../../../lib/server/app';
import { authorize } from '../../../../lib/server/guard';
import { fieldProblems, problem } from '../../../../lib/server/http';
import { exportQuerySchema } from '../../../../schemas/parts';
import { currentLibrary, libraryAt } from '../../../../features/parts/library.server';
import { exportFileName, libraryCsv } from '../../../../features/parts/csv-format';

/** The library (or one `category`) as CSV; `version` exports an earlier version. Every role. */
export const GET: APIRoute = async ({ locals, url }) => {
  const user = authorize(locals, 'readParts');
  if (user instanceof Response) return user;
  const query = exportQuerySchema.safeParse(Object.fromEntries(url.searchParams));
  if (!query.success) return problem(400, 'Some query parameters are not valid.', fieldProblems(query.error));
  const { db } = await getApp();
  const current = await currentLibrary(db);
  const chosen = query.data.version === undefined ? current : await libraryAt(db, query.data.version);
  if (!chosen) return problem(404, `There is no parts library version ${query.data.version}.`);
  return new Response(libraryCsv(chosen.library, query.data.category), {
    headers: {
      'content-type': 'text/csv; charset=utf-8',
      'content-disposition': `attachment; filename="${exportFileName(chosen.version, query.data.category)}"`,
      'cache-control': 'no-store',
    },
  });
};
