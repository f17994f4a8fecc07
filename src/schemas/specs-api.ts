import { z } from 'zod';
import { specInputSchema } from './spec';

const unknownKeys = (what: string) => (issue: { code?: string; keys?: string[] }) =>
  issue.code === 'unrecognized_keys' ? `unknown field(s): ${(issue.keys ?? []).join(', ')}` : `send ${what}`;

export const specNameSchema = z
  .string({ error: 'name is required and must be text' })
  .trim()
  .min(1, { error: 'name is required' })
  .max(160, { error: 'name must have at most 160 characters' });

export const specCustomerSchema = z
  .string({ error: 'customer must be text' })
  .trim()
  .max(160, { error: 'customer must have at most 160 characters' })
  .default('');

const requirementsEnvelope = z.record(z.string(), z.unknown(), { error: 'requirements must be an object of requirement fields' });

/**
 * Body of POST /api/v1/specs. `requirements` is checked field by field with the shared
 * requirement-set schema (src/schemas/spec.ts) after this envelope passes.
 */
export const specCreateSchema = z.strictObject(
  { name: specNameSchema, customer: specCustomerSchema, requirements: requirementsEnvelope },
  { error: unknownKeys('an object with name, customer and requirements') },
);

/** Body of PUT /api/v1/specs/:id: the version being edited guards against silent overwrites. */
export const specUpdateSchema = z.strictObject(
  {
    version: z.number({ error: 'version is required: the version you loaded' }).int({ error: 'version must be a whole number' }).min(1, { error: 'version must be at least 1' }),
    name: specNameSchema,
    customer: specCustomerSchema,
    requirements: requirementsEnvelope,
  },
  { error: unknownKeys('an object with version, name, customer and requirements') },
);

/** The same bodies as the OpenAPI document describes them (requirements in full). */
export const specCreateDocSchema = specCreateSchema.extend({ requirements: specInputSchema });
export const specUpdateDocSchema = specUpdateSchema.extend({ requirements: specInputSchema });

export const specListQuerySchema = z.strictObject({
  archived: z.enum(['0', '1'], { error: 'archived must be 0 or 1' }).optional(),
});
