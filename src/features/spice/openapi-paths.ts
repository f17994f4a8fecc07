import { z } from 'zod';
import type { ZodOpenApiPathsObject, ZodOpenApiResponsesObject } from 'zod-openapi';
import { problemSchema } from '../../schemas/responses';
import { candidateNetlistQuerySchema, specNetlistQuerySchema } from './query';

const netlist = { description: 'plain ngspice-compatible netlist (attachment, text/plain)', content: { 'text/plain': { schema: z.string() } } };
const errors = (entries: [number, string][]): ZodOpenApiResponsesObject =>
  Object.fromEntries(entries.map(([code, description]) => [String(code), { description, content: { 'application/json': { schema: problemSchema } } }]));

/** The SPICE netlist routes of /api/v1. */
export const spicePaths: ZodOpenApiPathsObject = {
  '/specs/{id}/netlist': {
    get: {
      summary: 'SPICE netlist of one scheme of a saved requirement set at Vin min, nom or max (every role)',
      requestParams: { path: z.object({ id: z.string().describe('requirement set id') }), query: specNetlistQuerySchema },
      responses: { '200': netlist, ...errors([[400, 'bad scheme or vin, each named with a plain reason'], [401, 'not signed in'], [404, 'no such requirement set'], [422, 'the engine found no complete design for this scheme']]) },
    },
  },
  '/shortlists/{id}/candidates/{candidateId}/netlist': {
    get: {
      summary: "SPICE netlist of a shortlist candidate from its newest frozen snapshot (sales: decided shortlists only)",
      requestParams: { path: z.object({ id: z.string().describe('shortlist id'), candidateId: z.string().describe('candidate id') }), query: candidateNetlistQuerySchema },
      responses: { '200': netlist, ...errors([[400, 'bad vin'], [401, 'not signed in'], [403, 'sales before the decision'], [404, 'no such shortlist, candidate or snapshot'], [422, 'the engine found no complete design for this candidate']]) },
    },
  },
};
