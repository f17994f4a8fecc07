import type { APIRoute } from 'astro';
import { getApp } from '../../../../../lib/server/app';
import { config } from '../../../../../lib/server/config';
import { authorize } from '../../../../../lib/server/guard';
import { fieldProblems, json, problem, readJson } from '../../../../../lib/server/http';
import { briefShareSchema } from '../../../../../schemas/briefs';
import { getBrief, recordShare, revokeShares } from '../../../../../db/queries/briefs';
import { loadBrief, sameContent } from '../../../../../features/briefs/service.server';
import { newShareToken, shareExpiry, shareUrl } from '../../../../../features/briefs/share.server';
import { z } from 'zod';

/**
 * A new read-only link to the latest version (`{expiresInDays?}`, default 30 days). When the
 * brief changed since its latest version, or has none, the current brief is frozen first.
 * The token is in this reply only; the server keeps its SHA-256.
 */
export const POST: APIRoute = async ({ locals, params, request }) => {
  const user = authorize(locals, 'writeBriefs');
  if (user instanceof Response) return user;
  const body = await readJson(request, briefShareSchema, { emptyAs: {} });
  if (!body.ok) return body.response;
  const { db } = await getApp();
  const id = params.id ?? '';
  const loaded = await loadBrief(db, id, { demo: config.demo });
  if (!loaded) return problem(404, 'No brief with this id.');
  const { token, tokenHash } = newShareToken();
  const expiresAt = shareExpiry(body.data.expiresInDays);
  const { version, share, frozeNew } = await recordShare(db, id, loaded.content, (latest) => sameContent(latest, loaded.content), { tokenHash, expiresAt }, user.id);
  return json({ version: version.version, frozeNewVersion: frozeNew, share: { id: share.id, url: shareUrl(config.linkOrigin, token), expiresAt: expiresAt.toISOString() } }, 201);
};

const revokeQuery = z.strictObject({ shareId: z.string().min(1, { error: 'shareId must not be empty' }).optional() });

/** Revokes every active link of the brief, or only `?shareId=`; the pages stop working at once. */
export const DELETE: APIRoute = async ({ locals, params, url }) => {
  const user = authorize(locals, 'writeBriefs');
  if (user instanceof Response) return user;
  const query = revokeQuery.safeParse(Object.fromEntries(url.searchParams));
  if (!query.success) return problem(400, 'Some query parameters are not valid.', fieldProblems(query.error));
  const { db } = await getApp();
  const id = params.id ?? '';
  if (!(await getBrief(db, id))) return problem(404, 'No brief with this id.');
  return json({ revoked: await revokeShares(db, id, user.id, query.data.shareId) });
};
