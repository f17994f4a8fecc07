import type { APIRoute } from 'astro';
import { getApp } from '../../../../lib/server/app';
import { authorize } from '../../../../lib/server/guard';
import { problem } from '../../../../lib/server/http';
import { getUpload } from '../../../../db/queries/uploads';
import { uploadContent } from '../../../../lib/server/uploads';
import { uploadCapability } from '../../../../features/parts/upload-access';
import { can } from '../../../../lib/roles';

/**
 * One stored file, as an attachment, to the roles that may see the item it belongs to (a spec,
 * a parts-library version). Ids are random; the stored name never leaves the server.
 */
export const GET: APIRoute = async ({ locals, params }) => {
  const user = authorize(locals);
  if (user instanceof Response) return user;
  const { db } = await getApp();
  const upload = await getUpload(db, params.id ?? '');
  const capability = upload ? uploadCapability(upload.relatedType) : null;
  if (!upload || !capability) return problem(404, 'No such file.');
  if (!can(user.role, capability)) return problem(403, 'Your role does not allow this.');
  let content: Buffer;
  try {
    content = await uploadContent(upload);
  } catch {
    return problem(404, 'The file is recorded but missing from the data folder.');
  }
  return new Response(new Uint8Array(content), {
    headers: {
      'content-type': upload.mimeType === 'application/json' ? 'application/json; charset=utf-8' : 'text/csv; charset=utf-8',
      'content-disposition': `attachment; filename="${upload.filename.replace(/[^\w. -]/g, '_')}"`,
      'content-length': String(content.byteLength),
      'x-content-sha256': upload.sha256,
      'cache-control': 'private, no-store',
    },
  });
};
