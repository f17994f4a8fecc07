import type { APIRoute } from 'astro';
import { getApp } from '../../../../lib/server/app';
import { authorize } from '../../../../lib/server/guard';
import { json } from '../../../../lib/server/http';
import { listLibraryHistory } from '../../../../db/queries/parts';
import { currentLibrary } from '../../../../features/parts/library.server';

/** Every library version, newest first: who, when, a summary and the per-part changes. */
export const GET: APIRoute = async ({ locals }) => {
  const user = authorize(locals, 'readParts');
  if (user instanceof Response) return user;
  const { db } = await getApp();
  await currentLibrary(db); // seeds version 1 on a fresh workspace
  const entries = await listLibraryHistory(db);
  return json({
    versions: entries.map((e) => ({
      version: e.version, summary: e.summary, changes: e.changes, by: e.actorName, at: e.createdAt.toISOString(),
      upload: e.uploadId ? { id: e.uploadId, filename: e.uploadName, url: `/api/v1/uploads/${e.uploadId}` } : null,
    })),
  });
};
