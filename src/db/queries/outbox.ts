import { desc } from 'drizzle-orm';
import type { Db } from '../client';
import { outbox, type OutboxMessage } from '../schema';

/** Newest messages first. */
export async function listOutbox(db: Db, limit = 200): Promise<OutboxMessage[]> {
  return db.select().from(outbox).orderBy(desc(outbox.createdAt)).limit(limit);
}
