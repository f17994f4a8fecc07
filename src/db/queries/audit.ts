import type { Db } from '../client';
import { auditLog } from '../schema';

export interface AuditInput {
  actorId: string | null;
  action: string;
  entityType: string;
  entityId?: string | null;
  details?: Record<string, unknown>;
}

/** Appends one entry to the audit log; call it inside the transaction that made the change. */
export async function recordAudit(db: Pick<Db, 'insert'>, entry: AuditInput): Promise<void> {
  await db.insert(auditLog).values({
    actorId: entry.actorId,
    action: entry.action,
    entityType: entry.entityType,
    entityId: entry.entityId ?? null,
    details: entry.details ?? {},
  });
}
