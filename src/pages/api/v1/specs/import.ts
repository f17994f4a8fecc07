import type { APIRoute } from 'astro';
import path from 'node:path';
import { getApp } from '../../../../lib/server/app';
import { authorize } from '../../../../lib/server/guard';
import { fieldProblems, json, problem } from '../../../../lib/server/http';
import { receiveTextFile, uploadRecord } from '../../../../lib/server/uploads';
import { specCustomerSchema, specNameSchema } from '../../../../schemas/specs-api';
import { createSpec, getSpec } from '../../../../db/queries/specs';
import { uploads } from '../../../../db/schema';
import { newId } from '../../../../db/ids';
import { checkRequirements } from '../../../../features/specs/requirements';
import { evaluateForStorage } from '../../../../features/specs/evaluate.server';
import { toSpecJson } from '../../../../features/specs/spec-json';
import { parseSpecFile } from '../../../../features/specs/import-file';

/**
 * A customer's requirement set from a JSON or CSV file (multipart field `file`; optional form
 * fields `name` and `customer` win over the file's). Created exactly as POST /specs does, with
 * the original file kept as an upload of the new set. Admins, architects and sales.
 */
export const POST: APIRoute = async ({ locals, request }) => {
  const user = authorize(locals, 'importSpecs');
  if (user instanceof Response) return user;
  const received = await receiveTextFile(request, ['json', 'csv']);
  if (!received.ok) return received.response;
  const { file, form } = received;
  const parsed = parseSpecFile(file.text, path.extname(file.filename).slice(1).toLowerCase());
  if (!parsed.ok) return problem(400, parsed.message, parsed.fields);
  const stem = path.basename(file.filename, path.extname(file.filename));
  const meta = {
    name: specNameSchema.safeParse(String(form.get('name') ?? '').trim() || parsed.value.name || stem),
    customer: specCustomerSchema.safeParse(String(form.get('customer') ?? '').trim() || parsed.value.customer || ''),
  };
  if (!meta.name.success) return problem(400, 'Some fields are not valid.', fieldProblems(meta.name.error).map((f) => ({ ...f, field: 'name' })));
  if (!meta.customer.success) return problem(400, 'Some fields are not valid.', fieldProblems(meta.customer.error).map((f) => ({ ...f, field: 'customer' })));
  const requirements = checkRequirements(parsed.value.requirements);
  if (!requirements.ok) return problem(400, 'Some fields are not valid.', requirements.errors);
  const { db } = await getApp();
  const write = await evaluateForStorage(db, meta.name.data, meta.customer.data, requirements.value);
  const stored = uploadRecord(file);
  let uploadId = '';
  const id = await createSpec(db, write, user.id, async (tx, specId) => {
    uploadId = newId();
    await tx.insert(uploads).values({ id: uploadId, ...stored, uploaderId: user.id, relatedType: 'spec', relatedId: specId });
  });
  const created = await getSpec(db, id);
  return json({ ...toSpecJson(created!), upload: { id: uploadId, filename: stored.filename, url: `/api/v1/uploads/${uploadId}` } }, 201, { location: `/api/v1/specs/${id}` });
};
