import type { APIRoute } from 'astro';
import { getApp } from '../../../lib/server/app';
import { authorize } from '../../../lib/server/guard';
import { json } from '../../../lib/server/http';
import { listOutbox } from '../../../db/queries/outbox';

/** Messages the app sent or captured (admins). */
export const GET: APIRoute = async ({ locals }) => {
  const user = authorize(locals, 'readOutbox');
  if (user instanceof Response) return user;
  const { db } = await getApp();
  const messages = await listOutbox(db);
  return json({
    messages: messages.map((m) => ({
      id: m.id, kind: m.kind, to: m.toAddresses, cc: m.ccAddresses, subject: m.subject, text: m.textBody, html: m.htmlBody,
      status: m.status, error: m.error, relatedType: m.relatedType, relatedId: m.relatedId, createdAt: m.createdAt.toISOString(),
    })),
  });
};
