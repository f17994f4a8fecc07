import { z } from 'zod';
import { createDocument, type ZodOpenApiOperationObject, type ZodOpenApiResponsesObject } from 'zod-openapi';
import { partsPaths } from '../parts/openapi-paths';
import { newUserSchema, signInSchema, userPatchSchema } from '../../schemas/auth';
import { specInputSchema } from '../../schemas/spec';
import { specCreateDocSchema, specUpdateDocSchema } from '../../schemas/specs-api';
import { shortlistPaths } from './shortlist-paths';
import { spicePaths } from '../spice/openapi-paths';
import { comparisonSchema, problemSchema, specJsonSchema, staleSchema, userJsonSchema, briefJsonSchema, briefShareReplySchema, briefSummarySchema } from '../../schemas/responses';
import { briefCreateSchema, briefSendDocSchema, briefShareSchema, briefUpdateSchema } from '../../schemas/briefs';

const body = (schema: z.ZodType) => ({ content: { 'application/json': { schema } } });
const reply = (description: string, schema?: z.ZodType) => (schema ? { description, ...body(schema) } : { description });
const errors = (...codes: (400 | 401 | 403 | 404 | 409 | 429 | 502)[]): ZodOpenApiResponsesObject => {
  const text: Record<number, string> = {
    400: 'bad input: each bad field with a plain reason',
    401: 'not signed in',
    403: 'role not allowed, or a write from another origin',
    404: 'no such item',
    409: 'conflict',
    429: 'too many attempts',
    502: 'the mail server refused the message',
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
      ...shortlistPaths,
      ...spicePaths,
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
      '/briefs': {
        get: op({
          summary: 'Feasibility briefs (every role)',
          requestParams: { query: z.object({ specId: z.string().optional().describe('only the briefs of this requirement set') }) },
          responses: { '200': reply('the briefs, newest change first', z.object({ briefs: z.array(briefSummarySchema) })), ...errors(400, 401) },
        }),
        post: op({ summary: 'Start a brief from a requirement set or a decided shortlist (sales, architect, admin)', requestBody: body(briefCreateSchema), responses: { '201': reply('created', briefJsonSchema), ...errors(400, 401, 403) } }),
      },
      '/briefs/{id}': {
        get: op({ summary: 'One brief: draft, live preview and frozen versions (every role)', requestParams: idParam, responses: { '200': reply('the brief', briefJsonSchema), ...errors(401, 404) } }),
        put: op({ summary: 'Save the editable brief (sales, architect, admin); a recommended scheme must be feasible', requestParams: idParam, requestBody: body(briefUpdateSchema), responses: { '200': reply('saved', briefJsonSchema), ...errors(400, 401, 403, 404) } }),
      },
      '/briefs/{id}/send': {
        post: op({
          summary: 'Freeze the next version, make its share link and e-mail it (sales, architect, admin)',
          requestParams: idParam,
          requestBody: body(briefSendDocSchema),
          responses: {
            '201': reply('sent (or captured in demo mode)', z.object({ version: z.number().int(), sentTo: z.array(z.string()), cc: z.array(z.string()), share: briefShareReplySchema, mail: z.object({ id: z.string(), status: z.string(), error: z.string().nullable() }) })),
            ...errors(400, 401, 403, 404, 502),
          },
        }),
      },
      '/briefs/{id}/share': {
        post: op({
          summary: 'A read-only link to the latest version, valid 30 days unless expiresInDays says otherwise (sales, architect, admin)',
          requestParams: idParam,
          requestBody: { ...body(briefShareSchema), required: false },
          responses: { '201': reply('the link', z.object({ version: z.number().int(), frozeNewVersion: z.boolean(), share: briefShareReplySchema })), ...errors(400, 401, 403, 404) },
        }),
        delete: op({
          summary: 'Revoke every live link of the brief, or one with ?shareId= (sales, architect, admin)',
          requestParams: { ...idParam, query: z.object({ shareId: z.string().optional() }) },
          responses: { '200': reply('how many links were revoked', z.object({ revoked: z.number().int() })), ...errors(400, 401, 403, 404) },
        }),
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
