import type { APIRoute } from 'astro';
import { getApp } from '../../../../../lib/server/app';
import { config } from '../../../../../lib/server/config';
import { authorize } from '../../../../../lib/server/guard';
import { json, readJson, problem } from '../../../../../lib/server/http';
import { briefSendSchema } from '../../../../../schemas/briefs';
import { recordSend } from '../../../../../db/queries/briefs';
import { loadBrief } from '../../../../../features/briefs/service.server';
import { newShareToken, shareExpiry, shareUrl } from '../../../../../features/briefs/share.server';
import { briefMail } from '../../../../../features/briefs/mail';

/**
 * `{to, cc?, message?, expiresInDays?}`: freezes the brief as the next version, makes a
 * read-only share link to it and mails both parts with the link (sales, architects, admins).
 */
export const POST: APIRoute = async ({ locals, params, request }) => {
  const user = authorize(locals, 'writeBriefs');
  if (user instanceof Response) return user;
  const body = await readJson(request, briefSendSchema);
  if (!body.ok) return body.response;
  const { db, mailer } = await getApp();
  const id = params.id ?? '';
  const loaded = await loadBrief(db, id, { demo: config.demo });
  if (!loaded) return problem(404, 'No brief with this id.');
  const { token, tokenHash } = newShareToken();
  const expiresAt = shareExpiry(body.data.expiresInDays);
  const to = body.data.to;
  const cc = body.data.cc ?? [];
  const { version, share } = await recordSend(db, id, loaded.content, [...to, ...cc].join(', '), { tokenHash, expiresAt }, user.id);
  const link = shareUrl(config.linkOrigin, token);
  const mail = briefMail({ content: loaded.content, version: version.version, link, expiresAt, message: body.data.message, senderName: user.displayName });
  const sent = await mailer.send({ kind: 'brief', to, cc, ...mail, related: { type: 'brief', id } });
  const reply = {
    version: version.version,
    sentTo: to,
    cc,
    share: { id: share.id, url: link, expiresAt: expiresAt.toISOString() },
    mail: { id: sent.id, status: sent.status, error: sent.error },
  };
  if (sent.status === 'failed') {
    return json({ error: `Version ${version.version} was frozen and its link made, but the mail could not be sent: ${sent.error ?? 'unknown error'}`, ...reply }, 502);
  }
  return json(reply, 201);
};
