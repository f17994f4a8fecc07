import { z } from 'zod';
import { ROLES } from '../lib/roles';

/** Reply shapes, for the OpenAPI document (the handlers build them with the *-json helpers). */
export const problemSchema = z
  .object({
    error: z.string().describe('what went wrong, in plain words'),
    fields: z.array(z.object({ field: z.string(), message: z.string() })).optional().describe('one entry per bad field'),
  })
  .meta({ id: 'Problem' });

export const userJsonSchema = z
  .object({
    id: z.string(),
    email: z.string(),
    name: z.string(),
    role: z.enum(ROLES),
    active: z.boolean(),
    createdAt: z.string(),
    updatedAt: z.string(),
  })
  .meta({ id: 'User' });

export const specJsonSchema = z
  .object({
    id: z.string(),
    name: z.string(),
    customer: z.string(),
    owner: z.object({ id: z.string(), name: z.string() }),
    requirements: z.record(z.string(), z.unknown()).describe('the requirement set, defaults filled (SI units)'),
    version: z.number().int(),
    archived: z.boolean(),
    engineVersion: z.string().nullable(),
    createdAt: z.string(),
    updatedAt: z.string(),
    updatedBy: z.string().nullable(),
  })
  .meta({ id: 'Spec' });

export const comparisonSchema = z
  .looseObject({
    engineVersion: z.string(),
    input: z.record(z.string(), z.unknown()),
    results: z.array(z.looseObject({ scheme: z.string(), feasible: z.boolean(), score: z.number() })),
    ranking: z.array(z.string()),
  })
  .describe('see src/engine/README.md for every field of a result')
  .meta({ id: 'Comparison' });

export const staleSchema = z
  .object({ error: z.string(), currentVersion: z.number().int(), updatedBy: z.string().nullable(), updatedAt: z.string() })
  .meta({ id: 'StaleVersion' });

export const briefSummarySchema = z
  .object({
    id: z.string(),
    specId: z.string(),
    specName: z.string(),
    shortlistId: z.string().nullable(),
    title: z.string(),
    customerName: z.string(),
    customerContact: z.string(),
    createdBy: z.string(),
    createdAt: z.string(),
    updatedAt: z.string(),
    latestVersion: z.number().int().nullable(),
    lastSentAt: z.string().nullable(),
  })
  .meta({ id: 'BriefSummary' });

const briefContentSchema = z
  .looseObject({
    title: z.string(),
    customerName: z.string(),
    verdicts: z.array(z.object({ scheme: z.string(), label: z.string(), verdict: z.enum(['feasible', 'marginal', 'not-feasible']), reasons: z.array(z.string()) })),
    recommended: z.looseObject({ scheme: z.string(), source: z.enum(['engine', 'edited', 'shortlist']) }).nullable(),
    cost: z.looseObject({ currency: z.string(), annualVolume: z.number(), bomCost: z.number(), lowPct: z.number(), highPct: z.number(), low: z.number(), high: z.number() }).nullable(),
    summary: z.string(),
    risks: z.array(z.string()),
    assumptions: z.array(z.string()),
  })
  .describe('the brief as the customer reads it (src/features/briefs/content.ts)')
  .meta({ id: 'BriefContent' });

export const briefJsonSchema = briefSummarySchema
  .extend({
    draft: z.record(z.string(), z.unknown()).describe('the editable fields (summary, recommendedScheme, contingency, extra risks and assumptions)'),
    preview: briefContentSchema.describe('the brief computed now from the saved requirement set and the draft'),
    versions: z.array(z.object({
      version: z.number().int(), sentTo: z.string(), sentBy: z.string().nullable(), sentAt: z.string().nullable(), frozenAt: z.string(),
      content: briefContentSchema,
      shares: z.array(z.object({ id: z.string(), createdAt: z.string(), expiresAt: z.string(), revokedAt: z.string().nullable(), views: z.number().int(), lastViewAt: z.string().nullable() })),
    })).describe('frozen versions, newest first'),
  })
  .meta({ id: 'Brief' });

export const briefShareReplySchema = z
  .object({ id: z.string(), url: z.string().describe('the read-only link; the token appears in this reply only'), expiresAt: z.string() })
  .meta({ id: 'BriefShareLink' });
