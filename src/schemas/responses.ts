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
