import type { APIRoute } from 'astro';
import { getApp } from '../../../lib/server/app';
import { json } from '../../../lib/server/http';

/** Readiness: answers once the database is open and migrated. Reveals nothing else. */
export const GET: APIRoute = async () => {
  await getApp();
  return json({ status: 'ok' });
};
