import type { APIRoute } from 'astro';
import { getApp } from '../../../../lib/server/app';
import { authorize } from '../../../../lib/server/guard';
import { fieldProblems, json, problem } from '../../../../lib/server/http';
import { receiveTextFile, uploadRecord } from '../../../../lib/server/uploads';
import { importQuerySchema } from '../../../../schemas/parts';
import { currentLibrary } from '../../../../features/parts/library.server';
import { previewImport } from '../../../../features/parts/csv-import';
import { commitChanges } from '../../../../features/parts/edit.server';
import { summariseChanges } from '../../../../features/parts/changes';
import { editReply } from '../../../../features/parts/replies.server';

/**
 * CSV import (admins), multipart field `file`. `?dryRun=1` returns the preview (rows to add,
 * change and retire; row errors with line numbers) and changes nothing. Without it the whole
 * file is applied as one new version in one transaction, or refused whole.
 */
export const POST: APIRoute = async ({ locals, request, url }) => {
  const user = authorize(locals, 'editParts');
  if (user instanceof Response) return user;
  const query = importQuerySchema.safeParse(Object.fromEntries(url.searchParams));
  if (!query.success) return problem(400, 'Some query parameters are not valid.', fieldProblems(query.error));
  const received = await receiveTextFile(request, ['csv', 'txt']);
  if (!received.ok) return received.response;
  const { db } = await getApp();
  const { library, version } = await currentLibrary(db);
  if (query.data.baseVersion !== undefined && query.data.baseVersion !== version) {
    return json({ error: `The parts library changed since the preview (now version ${version}); preview the file again.`, currentVersion: version }, 409);
  }
  const parsed = previewImport(received.file.text, library, version);
  if (!parsed.ok) return problem(400, parsed.message);
  const { preview } = parsed;
  const blocked = preview.errors.length + preview.problems.length > 0;
  if (query.data.dryRun === '1') return json({ preview, canApply: !blocked && preview.changes.length > 0, filename: received.file.filename });
  if (blocked) {
    const fields = [...preview.errors.map((e) => ({ field: `line ${e.line}`, message: e.message })), ...preview.problems.map((message) => ({ field: 'library', message }))];
    return json({ error: `The file has ${fields.length} problem${fields.length === 1 ? '' : 's'}; nothing was changed.`, fields, preview }, 400);
  }
  if (preview.changes.length === 0) return json({ version, changes: [], uploadId: null });
  const outcome = await commitChanges(db, user.id, preview.changes.map(({ line: _line, ...change }) => change), {
    baseVersion: version, upload: uploadRecord(received.file), summary: `CSV import of ${received.file.filename}: ${summariseChanges(preview.changes)}`,
  });
  return editReply(outcome);
};
