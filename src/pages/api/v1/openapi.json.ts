import type { APIRoute } from 'astro';
import { openApiDocument } from '../../../features/api-docs/openapi';
import { json } from '../../../lib/server/http';

let document: ReturnType<typeof openApiDocument> | undefined;

/** The OpenAPI 3.1 description of /api/v1 (public: it holds no data). */
export const GET: APIRoute = () => {
  document ??= openApiDocument();
  return json(document);
};
