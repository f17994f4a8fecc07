import { z } from 'zod';
import type { ZodOpenApiPathsObject, ZodOpenApiResponsesObject } from 'zod-openapi';
import { problemSchema, specJsonSchema } from '../../schemas/responses';
import {
  exportQuerySchema, fileUploadSchema, historyReplySchema, importPreviewReplySchema, importQuerySchema, libraryReplySchema,
  libraryWriteReplySchema, partCreateSchema, partUpdateSchema,
} from '../../schemas/parts';

const json = (schema: z.ZodType) => ({ content: { 'application/json': { schema } } });
const reply = (description: string, schema?: z.ZodType) => (schema ? { description, ...json(schema) } : { description });
const TEXT: Record<number, string> = {
  400: 'bad input: each bad field (or file line) with a plain reason; nothing changed',
  401: 'not signed in',
  403: 'role not allowed, or a write from another origin',
  404: 'no such item',
  409: 'the library changed meanwhile (`currentVersion`), or the id is taken',
  413: 'file larger than 2 MB',
  415: 'not a text file of the accepted kind',
};
const errors = (...codes: number[]): ZodOpenApiResponsesObject => Object.fromEntries(codes.map((c) => [String(c), reply(TEXT[c]!, problemSchema)]));
const multipart = (schema: z.ZodType) => ({ content: { 'multipart/form-data': { schema } } });
const idParam = { path: z.object({ id: z.string().describe('part id') }) };

/** Parts library, imports and uploads in the OpenAPI document. */
export const partsPaths: ZodOpenApiPathsObject = {
  '/parts': {
    get: { summary: 'The current parts library (every role)', responses: { '200': reply('the library and its version', libraryReplySchema), ...errors(401) } },
    post: { summary: 'Add a part as a new library version (admin)', requestBody: json(partCreateSchema), responses: { '201': reply('new version', libraryWriteReplySchema), ...errors(400, 401, 403, 409) } },
  },
  '/parts/{id}': {
    put: { summary: 'Replace a part\'s fields as a new library version (admin)', requestParams: idParam, requestBody: json(partUpdateSchema), responses: { '200': reply('new version (or none when nothing differs)', libraryWriteReplySchema), ...errors(400, 401, 403, 404, 409) } },
    delete: { summary: 'Retire (remove) a part as a new library version; earlier versions keep it (admin)', requestParams: { ...idParam, query: z.object({ baseVersion: z.number().int().optional() }) }, responses: { '200': reply('new version', libraryWriteReplySchema), ...errors(400, 401, 403, 404, 409) } },
  },
  '/parts/import': {
    post: {
      summary: 'CSV import (admin): `?dryRun=1` previews rows to add, change and retire with line-numbered errors; otherwise applies all in one transaction or nothing',
      requestParams: { query: importQuerySchema },
      requestBody: multipart(fileUploadSchema('the CSV file, columns as in the export')),
      responses: { '200': reply('preview (dry run) or the new version', z.union([importPreviewReplySchema, libraryWriteReplySchema])), ...errors(400, 401, 403, 409, 413, 415) },
    },
  },
  '/parts/export.csv': {
    get: {
      summary: 'The library, one category or an earlier version as CSV (every role); text cells guarded against spreadsheet formulas',
      requestParams: { query: exportQuerySchema },
      responses: { '200': { description: 'CSV file', content: { 'text/csv': { schema: z.string() } } }, ...errors(400, 401, 404) },
    },
  },
  '/parts/history': {
    get: { summary: 'Every library version: who, when, what changed (every role)', responses: { '200': reply('versions, newest first', historyReplySchema), ...errors(401) } },
  },
  '/specs/import': {
    post: {
      summary: "Create a requirement set from a customer's JSON or CSV file (API field names; values may carry units, e.g. \"48 V\", \"200 kHz\"); the file is kept (admin, architect, sales)",
      requestBody: multipart(fileUploadSchema('the .json or .csv file', { name: z.string().optional(), customer: z.string().optional() })),
      responses: { '201': reply('created, with the kept file', specJsonSchema.extend({ upload: z.object({ id: z.string(), filename: z.string(), url: z.string() }) })), ...errors(400, 401, 403, 413, 415) },
    },
  },
  '/uploads/{id}': {
    get: {
      summary: 'Download a kept file, for roles that may see the item it belongs to',
      requestParams: { path: z.object({ id: z.string().describe('upload id') }) },
      responses: { '200': { description: 'the file as an attachment; header x-content-sha256' }, ...errors(401, 403, 404) },
    },
  },
};
