import { z } from 'zod';
import { createDocument, type ZodOpenApiOperationObject, type ZodOpenApiResponsesObject } from 'zod-openapi';
import { partsPaths } from '../parts/openapi-paths';
import { newUserSchema, signInSchema, userPatchSchema } from '../../schemas/auth';
import { specInputSchema } from '../../schemas/spec';
import { specCreateDocSchema, specUpdateDocSchema } from '../../schemas/specs-api';
import { comparisonSchema, problemSchema, specJsonSchema, staleSchema, userJsonSchema } from '../../schemas/responses';

const body = (schema: z.ZodType) => ({ content: { 'application/json': { schema } } });
const reply = (description: string, schema?: z.ZodType) => (schema ? { description, ...body(schema) } : { description });
const errors = (...codes: (400 | 401 | 403 | 404 | 409 | 429)[]): ZodOpenApiResponsesObject => {
  const text: Record<number, string> = {
    400: 'bad input: each bad field with a plain reason',
    401: 'not signed in',
    403: 'role not allowed, or a write from another origin',
    404: 'no such item',
    409: 'conflict',
    429: 'too many attempts',
  };
  return Object.fromEntries(codes.map((c) => [String(c), reply(text[c]!, problemSchema)]));
};
const idParam = { path: z.object({ id: z.string().describe('id of the item') }) };
const op = (o: ZodOpenApiOperationObject): ZodOpenApiOperationObject => o;

/** The OpenAPI 3.1 document of /api/v1, generated from the same zod schemas the handlers use. */
export function openApiDocument(): ReturnType<typeof createDocument> {
  return createDocument({
    openapi: '3.1.0',
    info: {
      title: 'Resetwise API',
      version: '1',
      description:
        'Requirement sets and reset-scheme comparisons for forward converters. Sign in with POST /auth/sign-in; the session cookie authorises later calls. Writes from browsers must come from this server\'s origin.',
    },
    servers: [{ url: '/api/v1' }],
    components: { securitySchemes: { session: { type: 'apiKey', in: 'cookie', name: 'rw_session' } } },
    security: [{ session: [] }],
    paths: {
      ...partsPaths,
      '/auth/sign-in': {
        post: op({ summary: 'Sign in', security: [], requestBody: body(signInSchema), responses: { '200': reply('signed in; sets the session cookie'), ...errors(400, 401, 429) } }),
      },
      '/auth/sign-out': { post: op({ summary: 'Sign out (ends the session on the server)', responses: { '200': reply('signed out') } }) },
      '/auth/me': { get: op({ summary: 'The signed-in member', responses: { '200': reply('the member'), ...errors(401) } }) },
      '/users': {
        get: op({ summary: 'Team members (admin)', responses: { '200': reply('members', z.object({ users: z.array(userJsonSchema) })), ...errors(401, 403) } }),
        post: op({ summary: 'Add a member (admin)', requestBody: body(newUserSchema), responses: { '201': reply('created', userJsonSchema), ...errors(400, 401, 403, 409) } }),
      },
      '/users/{id}': {
        patch: op({ summary: 'Change role or active flag (admin)', requestParams: idParam, requestBody: body(userPatchSchema), responses: { '200': reply('updated', userJsonSchema), ...errors(400, 401, 403, 404, 409) } }),
      },
      '/evaluate': {
        post: op({ summary: 'Compare every reset scheme for one requirement set (any signed-in member)', requestBody: body(specInputSchema), responses: { '200': reply('the comparison', comparisonSchema), ...errors(400, 401) } }),
      },
      '/specs': {
        get: op({
          summary: 'Requirement sets',
          requestParams: { query: z.object({ archived: z.enum(['0', '1']).optional().describe('1 includes archived sets') }) },
          responses: { '200': reply('the sets', z.object({ specs: z.array(specJsonSchema) })), ...errors(400, 401) },
        }),
        post: op({ summary: 'Create a requirement set (architect, admin)', requestBody: body(specCreateDocSchema), responses: { '201': reply('created', specJsonSchema), ...errors(400, 401, 403) } }),
      },
      '/specs/{id}': {
        get: op({ summary: 'One requirement set', requestParams: idParam, responses: { '200': reply('the set', specJsonSchema), ...errors(401, 404) } }),
        put: op({
          summary: 'Save a new version (architect, admin); `version` must be the current one',
          requestParams: idParam,
          requestBody: body(specUpdateDocSchema),
          responses: { '200': reply('saved', specJsonSchema), '409': reply('someone saved a newer version', staleSchema), ...errors(400, 401, 403, 404) },
        }),
        delete: op({ summary: 'Archive a requirement set (architect, admin)', requestParams: idParam, responses: { '200': reply('archived'), ...errors(401, 403, 404) } }),
      },
      '/specs/{id}/comparison': {
        get: op({
          summary: "The server's comparison of the saved version",
          requestParams: { ...idParam, query: z.object({ fresh: z.enum(['1']).optional().describe('re-evaluate with the current parts library (nothing saved)') }) },
          responses: {
            '200': reply('stored comparison (re-evaluated when the engine changed; `?fresh=1` against the current parts library)', z.object({ specId: z.string(), specVersion: z.number(), evaluatedAt: z.string().nullable(), storedEngineVersion: z.string().nullable(), reevaluated: z.boolean(), libraryVersion: z.number().int(), storedLibraryVersion: z.string().nullable(), libraryChanged: z.boolean().describe('the stored result used another parts-library version'), notice: z.string().optional(), comparison: comparisonSchema })),
            ...errors(401, 404),
          },
        }),
      },
    },
  });
}
