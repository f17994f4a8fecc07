import { z } from 'zod';
import type { ZodOpenApiPathsObject, ZodOpenApiResponsesObject } from 'zod-openapi';
import { ballotSchema, candidateCreateSchema, decisionSchema, emptyBodySchema, openVotingSchema, shortlistCreateSchema } from '../../schemas/shortlists';
import { problemSchema } from '../../schemas/responses';

const body = (schema: z.ZodType) => ({ content: { 'application/json': { schema } } });
const ok = (description: string, schema?: z.ZodType) => (schema ? { description, ...body(schema) } : { description });
const TEXT: Record<number, string> = {
  400: 'bad input: each bad field with a plain reason',
  401: 'not signed in',
  403: 'role not allowed, not the owner, or not an invited voter',
  404: 'no such shortlist or candidate',
  409: 'not allowed in the shortlist\'s current status (e.g. a ballot after close)',
};
const errors = (...codes: (400 | 401 | 403 | 404 | 409)[]): ZodOpenApiResponsesObject =>
  Object.fromEntries(codes.map((c) => [String(c), ok(TEXT[c]!, problemSchema)]));
const shortlistId = { path: z.object({ id: z.string().describe('shortlist id') }) };
const candidateParams = { path: z.object({ id: z.string().describe('shortlist id'), candidateId: z.string().describe('candidate id') }) };

const tallySchema = z
  .object({
    ballots: z.number().int(),
    candidates: z.array(z.object({ candidateId: z.string(), borda: z.number().int(), firstPreferences: z.number().int(), concerns: z.array(z.object({ voterName: z.string(), reason: z.string() })) })),
  })
  .describe('Borda count (n − 1 points for a first choice) and first preferences; present only when the caller may see results')
  .meta({ id: 'Tally' });

const shortlistSchema = z
  .looseObject({
    id: z.string(),
    title: z.string(),
    status: z.enum(['draft', 'voting', 'closed', 'decided', 'withdrawn']),
    spec: z.object({ id: z.string(), name: z.string(), version: z.number().int(), customer: z.string() }),
    deadline: z.string().nullable(),
    candidates: z.array(z.looseObject({ id: z.string(), scheme: z.string(), note: z.string(), result: z.record(z.string(), z.unknown()), staleReasons: z.array(z.string()) })),
    voters: z.array(z.object({ id: z.string(), name: z.string(), role: z.string(), voted: z.boolean() })),
    canVote: z.boolean(),
    tally: tallySchema.optional(),
    history: z.array(z.object({ action: z.string(), actor: z.string().nullable(), at: z.string(), details: z.record(z.string(), z.unknown()) })),
  })
  .meta({ id: 'Shortlist' });

/** The shortlist routes of /api/v1, from the same zod schemas the handlers validate with. */
export const shortlistPaths: ZodOpenApiPathsObject = {
  '/shortlists': {
    get: {
      summary: 'Shortlists (sales: decided ones only)',
      requestParams: { query: z.object({ specId: z.string().optional() }) },
      responses: { '200': ok('shortlists'), ...errors(400, 401) },
    },
    post: { summary: 'Start a draft shortlist for a spec (architect, admin)', requestBody: body(shortlistCreateSchema), responses: { '201': ok('created'), ...errors(400, 401, 403, 404) } },
  },
  '/shortlists/{id}': {
    get: { summary: 'A shortlist with candidates, voters, history and (when visible) the tally', requestParams: shortlistId, responses: { '200': ok('the shortlist', shortlistSchema), ...errors(401, 403, 404) } },
  },
  '/shortlists/{id}/candidates': {
    post: { summary: 'Freeze a scheme of the saved spec as a candidate (draft; architects, engineers, admins)', requestParams: shortlistId, requestBody: body(candidateCreateSchema), responses: { '201': ok('the candidate with its frozen result'), ...errors(400, 401, 403, 404, 409) } },
  },
  '/shortlists/{id}/candidates/{candidateId}': {
    delete: { summary: 'Remove a candidate (owner, draft)', requestParams: candidateParams, responses: { '200': ok('removed'), ...errors(401, 403, 404, 409) } },
  },
  '/shortlists/{id}/candidates/{candidateId}/reevaluate': {
    post: { summary: 'New snapshot from the current spec and engine; the old one is kept (owner, draft)', requestParams: candidateParams, requestBody: body(emptyBodySchema), responses: { '200': ok('re-evaluated'), ...errors(400, 401, 403, 404, 409) } },
  },
  '/shortlists/{id}/open': {
    post: { summary: 'Open voting (draft), or extend the deadline and invite more voters (voting); e-mails new voters (owner)', requestParams: shortlistId, requestBody: body(openVotingSchema), responses: { '200': ok('voting'), ...errors(400, 401, 403, 404, 409) } },
  },
  '/shortlists/{id}/ballot': {
    put: { summary: 'Cast (201) or change (200) your ballot while voting is open (invited voters)', requestParams: shortlistId, requestBody: body(ballotSchema), responses: { '200': ok('changed'), '201': ok('cast'), ...errors(400, 401, 403, 404, 409) } },
  },
  '/shortlists/{id}/close': {
    post: { summary: 'Close voting (owner)', requestParams: shortlistId, requestBody: body(emptyBodySchema), responses: { '200': ok('closed'), ...errors(400, 401, 403, 404, 409) } },
  },
  '/shortlists/{id}/decision': {
    post: { summary: 'Record the chosen candidate and the rationale after close (owner)', requestParams: shortlistId, requestBody: body(decisionSchema), responses: { '200': ok('decided'), ...errors(400, 401, 403, 404, 409) } },
  },
  '/shortlists/{id}/withdraw': {
    post: { summary: 'Withdraw a shortlist that will not be decided (owner)', requestParams: shortlistId, requestBody: body(emptyBodySchema), responses: { '200': ok('withdrawn'), ...errors(400, 401, 403, 404, 409) } },
  },
  '/outbox': {
    get: { summary: 'Messages the app sent or captured (admin)', responses: { '200': ok('messages'), ...errors(401, 403) } },
  },
};
