import './zod-browser';
import { z } from 'zod';
import { CATEGORIES, CATEGORY_KEYS, MAX_TIERS, PART_STATUSES, type CategoryInfo, type PartField } from '../features/parts/categories';
import type { PartCategory, PartsLibrary } from '../engine/parts/types';

/**
 * Zod schemas of library parts, built from the category table so the screen, the CSV import and
 * the API check exactly the same things. Values in SI units; plain messages.
 */

/** A spreadsheet runs a text cell starting with one of these as a formula. */
export const FORMULA_START = /^[=+\-@\t\r]/;

const safeText = (what: string, max: number) =>
  z
    .string({ error: `${what} must be text` })
    .trim()
    .max(max, { error: `${what} must have at most ${max} characters` })
    .refine((s) => !FORMULA_START.test(s), { error: `${what} must not start with = + - @ (a spreadsheet would run it as a formula)` });

export const partIdSchema = z
  .string({ error: 'id is required' })
  .trim()
  .min(1, { error: 'id is required' })
  .max(64, { error: 'id must have at most 64 characters' })
  .regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, { error: 'id may use letters, digits and . _ - and must start with a letter or digit' });

export const priceTierSchema = z.strictObject({
  minQty: z.number({ error: 'tier quantity must be a number' }).int({ error: 'tier quantity must be a whole number' }).min(1, { error: 'tier quantity must be at least 1' }).max(1e9),
  unitPrice: z.number({ error: 'unit price must be a number' }).min(0, { error: 'unit price must not be negative' }).max(1e6, { error: 'unit price above 1 000 000 is not plausible' }),
});

export const tiersSchema = z
  .array(priceTierSchema, { error: 'tiers must be a list of {minQty, unitPrice}' })
  .min(1, { error: 'give at least one price tier' })
  .max(MAX_TIERS, { error: `at most ${MAX_TIERS} price tiers` })
  .refine((tiers) => tiers.every((t, i) => i === 0 || t.minQty > tiers[i - 1]!.minQty), { error: 'tier quantities must rise from one tier to the next' });

function fieldSchema(field: PartField): z.ZodType {
  if (field.kind === 'choice') return z.enum(field.options as [string, ...string[]], { error: `${field.key} must be one of ${field.options!.join(', ')}` });
  if (field.kind === 'text') return safeText(field.key, 40).pipe(z.string().min(1, { error: `${field.key} is required` }));
  const base = z.number({ error: `${field.key} must be a number` }).refine(Number.isFinite, { error: `${field.key} must be a finite number` });
  return field.positive
    ? base.refine((v) => v > 0, { error: `${field.key} must be greater than zero` })
    : base.refine((v) => v >= 0, { error: `${field.key} must not be negative` });
}

/** The schema of one part of a category (unknown fields are refused by name). */
export function partSchema(category: CategoryInfo): z.ZodType<Record<string, unknown>> {
  const shape: Record<string, z.ZodType> = {
    id: partIdSchema,
    description: safeText('description', 200).optional(),
    status: z.enum(PART_STATUSES, { error: 'status must be preferred, allowed or nfnd (not for new designs)' }),
    tiers: tiersSchema,
  };
  for (const field of category.fields) shape[field.key] = fieldSchema(field);
  return z.strictObject(shape, {
    error: (issue) => (issue.code === 'unrecognized_keys' ? `unknown field(s) for a ${category.singular}: ${(issue.keys as string[]).join(', ')}` : `send a ${category.singular} as an object`),
  }) as unknown as z.ZodType<Record<string, unknown>>;
}

const schemaCache = new Map<PartCategory, z.ZodType<Record<string, unknown>>>();
export function partSchemaOf(category: PartCategory): z.ZodType<Record<string, unknown>> {
  let schema = schemaCache.get(category);
  if (!schema) {
    schema = partSchema(CATEGORIES.find((c) => c.key === category)!);
    schemaCache.set(category, schema);
  }
  return schema;
}

export const categorySchema = z.enum(CATEGORY_KEYS as [PartCategory, ...PartCategory[]], {
  error: `category must be one of ${CATEGORY_KEYS.join(', ')}`,
});

/** Body of POST /api/v1/parts: a new part in one category. */
export const partCreateSchema = z.strictObject({
  category: categorySchema,
  part: z.record(z.string(), z.unknown(), { error: 'part must be an object of part fields' }),
  baseVersion: z.number().int().min(1).optional().describe('library version the change was made against; 409 when it is no longer current'),
});

/** Body of PUT /api/v1/parts/:id: the whole part as it should read (its id and category stay). */
export const partUpdateSchema = z.strictObject({
  part: z.record(z.string(), z.unknown(), { error: 'part must be an object of part fields' }),
  baseVersion: z.number().int().min(1).optional().describe('library version the change was made against; 409 when it is no longer current'),
});

/** Query of GET /api/v1/parts/export.csv. */
export const exportQuerySchema = z.strictObject({
  category: categorySchema.optional(),
  version: z.coerce.number({ error: 'version must be a whole number' }).int({ error: 'version must be a whole number' }).min(1, { error: 'version must be at least 1' }).optional(),
});

/** Query of POST /api/v1/parts/import. */
export const importQuerySchema = z.strictObject({
  dryRun: z.enum(['0', '1'], { error: 'dryRun must be 0 or 1' }).optional(),
  baseVersion: z.coerce.number().int().min(1, { error: 'baseVersion must be at least 1' }).optional(),
});

/** Library-level fields stored beside the parts. */
export const libraryHeaderSchema = z.object({
  name: z.string().min(1),
  currency: z.string().regex(/^[A-Z]{3}$/),
  demo: z.boolean().optional(),
  note: z.string().optional(),
});

/** Categories added after libraries were first stored: a stored version without one has none of those parts. */
const LATER_CATEGORIES: ReadonlySet<PartCategory> = new Set(['windings']);

/** Checks a stored library JSON; returns the typed library (version filled by the caller). */
export function parseStoredLibrary(raw: unknown, version: number): PartsLibrary {
  const header = libraryHeaderSchema.parse(raw);
  const record = raw as Record<string, unknown>;
  const library: Record<string, unknown> = { ...header, version: String(version) };
  for (const category of CATEGORIES) {
    // Versions stored before a category existed (windings came with engine 0.3) read as an empty list of it.
    const list = record[category.key] ?? (LATER_CATEGORIES.has(category.key) ? [] : undefined);
    if (!Array.isArray(list)) throw new Error(`stored parts library version ${version} has no ${category.key} list`);
    library[category.key] = list.map((part) => partSchemaOf(category.key).parse(part));
  }
  // Every category was parsed by its part schema just above; the table of categories is the type's.
  return library as PartsLibrary;
}

// ── Reply shapes (for the OpenAPI document) ─────────────────────────────────────────────────

const changeSchema = z.looseObject({ op: z.enum(['add', 'change', 'retire']), category: z.string(), id: z.string(), fields: z.record(z.string(), z.object({ from: z.unknown(), to: z.unknown() })).optional() });

export const libraryReplySchema = z
  .object({ version: z.number().int().describe('database version number of the current library'), library: z.looseObject({ name: z.string(), version: z.string(), currency: z.string() }).describe('every category as a list of parts, SI units') })
  .meta({ id: 'PartsLibrary' });

export const libraryWriteReplySchema = z
  .object({ version: z.number().int(), changes: z.array(changeSchema), uploadId: z.string().nullable() })
  .meta({ id: 'PartsLibraryWrite' });

export const importPreviewReplySchema = z
  .object({
    preview: z.object({
      baseVersion: z.number().int(), rows: z.number().int(), unchanged: z.number().int(),
      changes: z.array(changeSchema.extend({ line: z.number().int() })),
      errors: z.array(z.object({ line: z.number().int(), id: z.string().nullable(), message: z.string() })),
      problems: z.array(z.string()),
    }),
    canApply: z.boolean(),
    filename: z.string(),
  })
  .meta({ id: 'PartsImportPreview' });

export const historyReplySchema = z
  .object({
    versions: z.array(z.object({
      version: z.number().int(), summary: z.string(), changes: z.array(changeSchema), by: z.string().nullable(), at: z.string(),
      upload: z.object({ id: z.string(), filename: z.string().nullable(), url: z.string() }).nullable(),
    })),
  })
  .meta({ id: 'PartsHistory' });

/** A multipart body with one file (field `file`) and optional text fields. */
export const fileUploadSchema = (description: string, extra: Record<string, z.ZodType> = {}) =>
  z.object({ file: z.string().meta({ format: 'binary', description }), ...extra });
