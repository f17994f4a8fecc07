import './zod-browser';
import { z } from 'zod';
import { SCHEME_IDS } from '../engine/scheme-ids';

/**
 * Bodies of the /api/v1/briefs endpoints and the editable draft of a brief. One schema per
 * body, shared by the endpoints, the editor island and the OpenAPI document.
 */

const unknownKeys = (what: string) => (issue: { code?: string; keys?: string[] }) =>
  issue.code === 'unrecognized_keys' ? `unknown field(s): ${(issue.keys ?? []).join(', ')}` : `send ${what}`;

const text = (field: string, max: number) =>
  z.string({ error: `${field} must be text` }).trim().max(max, { error: `${field} must have at most ${max} characters` });

export const DEFAULT_CONTINGENCY = { lowPct: 10, highPct: 25 } as const;
export const DEFAULT_SHARE_DAYS = 30;

/** The editable part of a brief, stored in `briefs.draft`. `null` means "use the generated value". */
export const briefDraftSchema = z.strictObject({
  summary: text('summary', 4000).nullable().default(null).describe('summary text; null uses the generated summary'),
  recommendedScheme: z.enum(SCHEME_IDS, { error: `recommendedScheme must be one of ${SCHEME_IDS.join(', ')}` })
    .nullable().default(null).describe("recommended scheme; null uses the engine ranking's best feasible scheme"),
  contingencyLowPct: z.number({ error: 'contingencyLowPct must be a number (%)' })
    .min(0, { error: 'contingencyLowPct must be at least 0 %' }).max(90, { error: 'contingencyLowPct must be at most 90 %' })
    .default(DEFAULT_CONTINGENCY.lowPct).describe('cost band below the BOM estimate, %; default 10'),
  contingencyHighPct: z.number({ error: 'contingencyHighPct must be a number (%)' })
    .min(0, { error: 'contingencyHighPct must be at least 0 %' }).max(300, { error: 'contingencyHighPct must be at most 300 %' })
    .default(DEFAULT_CONTINGENCY.highPct).describe('cost band above the BOM estimate, %; default 25'),
  risksText: text('risksText', 4000).default('').describe('further risks, one per line'),
  assumptionsText: text('assumptionsText', 4000).default('').describe('further assumptions, one per line'),
});
export type BriefDraft = z.output<typeof briefDraftSchema>;

const customerName = text('customerName', 160).min(1, { error: 'customerName is required' });
const customerContact = text('customerContact', 240);
const title = text('title', 200).min(1, { error: 'title must not be empty' });

/** POST /api/v1/briefs: a brief from a requirement set, or from a decided shortlist of it. */
export const briefCreateSchema = z.strictObject(
  {
    specId: z.string({ error: 'specId is required' }).min(1, { error: 'specId is required' }),
    shortlistId: z.string({ error: 'shortlistId must be text' }).min(1, { error: 'shortlistId must not be empty' }).optional(),
    title: title.optional().describe('default: "Feasibility brief: <spec name>"'),
    customerName: customerName.optional().describe("default: the requirement set's customer"),
    customerContact: customerContact.optional(),
  },
  { error: unknownKeys('an object with specId and optionally shortlistId, title, customerName, customerContact') },
);

/** PUT /api/v1/briefs/:id: the whole editable brief (draft fields plus title and customer). */
export const briefUpdateSchema = briefDraftSchema.extend({
  title,
  customerName,
  customerContact: customerContact.default(''),
});
export type BriefUpdate = z.output<typeof briefUpdateSchema>;

const email = z.email({ error: (issue) => `${String(issue.input)} is not a valid e-mail address` });
const addresses = (field: string, min: number) =>
  z.preprocess(
    (v) => (typeof v === 'string' ? v.split(/[,;]/).map((s) => s.trim()).filter(Boolean) : v),
    z.array(email, { error: `${field} must be an e-mail address or a list of them` })
      .min(min, { error: `${field} needs at least one e-mail address` })
      .max(20, { error: `${field} may list at most 20 addresses` }),
  );

const expiresInDays = z.number({ error: 'expiresInDays must be a number of days' }).int({ error: 'expiresInDays must be a whole number of days' })
  .min(1, { error: 'expiresInDays must be at least 1' }).max(365, { error: 'expiresInDays must be at most 365' });

/** POST /api/v1/briefs/:id/send: freezes a version, makes its share link and mails it. */
export const briefSendSchema = z.strictObject(
  {
    to: addresses('to', 1).describe('recipient address(es): a list, or one text with commas'),
    cc: addresses('cc', 0).optional(),
    message: text('message', 4000).optional().describe('a personal note above the brief'),
    expiresInDays: expiresInDays.optional().describe('days the share link stays valid; default 30'),
  },
  { error: unknownKeys('an object with to and optionally cc, message, expiresInDays') },
);

/** POST /api/v1/briefs/:id/share: a new read-only link to the latest version. */
export const briefShareSchema = z.strictObject(
  { expiresInDays: expiresInDays.optional().describe('days the link stays valid; default 30') },
  { error: unknownKeys('an object with optionally expiresInDays') },
);

export const briefListQuerySchema = z.strictObject({
  specId: z.string().min(1, { error: 'specId must not be empty' }).optional(),
});

/** Documentation shapes (the OpenAPI document lists addresses as arrays). */
export const briefSendDocSchema = z.object({
  to: z.array(z.email()).min(1),
  cc: z.array(z.email()).optional(),
  message: z.string().max(4000).optional(),
  expiresInDays: z.number().int().min(1).max(365).optional(),
});
