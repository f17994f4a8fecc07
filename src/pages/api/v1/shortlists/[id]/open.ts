import type { APIRoute } from 'astro';
import { getApp } from '../../../../../lib/server/app';
import { config } from '../../../../../lib/server/config';
import { authorize } from '../../../../../lib/server/guard';
import { json, readJson } from '../../../../../lib/server/http';
import { openVotingSchema } from '../../../../../schemas/shortlists';
import { getShortlist, loadShortlistParts, openVoting } from '../../../../../db/queries/shortlists';
import { ruled } from '../../../../../features/shortlists/http.server';
import { notifyVotingOpened } from '../../../../../features/shortlists/notify.server';

/**
 * `{deadline, voterIds}`: opens voting on a draft (owner), or while voting extends the deadline
 * and invites more voters. New voters are e-mailed a link.
 */
export const POST: APIRoute = async ({ locals, params, request }) => {
  const user = authorize(locals, 'editSpecs');
  if (user instanceof Response) return user;
  const body = await readJson(request, openVotingSchema);
  if (!body.ok) return body.response;
  const { db, mailer } = await getApp();
  const id = params.id ?? '';
  return ruled(async () => {
    const before = new Set((await loadShortlistParts(db, id)).voters.map((v) => v.id));
    await openVoting(db, id, { deadline: new Date(body.data.deadline), voterIds: [...new Set(body.data.voterIds)] }, user);
    const invited = [...new Set(body.data.voterIds)].filter((v) => !before.has(v));
    const mailed = await notifyVotingOpened(db, mailer, id, invited, config.linkOrigin);
    const row = await getShortlist(db, id);
    return json({ status: row?.status, deadline: row?.deadline?.toISOString(), invited: invited.length, mailed });
  });
};
