import type { Db } from '../client';
import { auditLog } from '../schema';

export interface AuditInput {
  actorId: string | null;
  action: string;
  entityType: string;
  entityId?: string | null;
  details?: Record<string, unknown>;
}

const row = (entry: AuditInput) => ({
  actorId: entry.actorId,
  action: entry.action,
  entityType: entry.entityType,
  entityId: entry.entityId ?? null,
  details: entry.details ?? {},
});

/** Appends one entry to the audit log; call it inside the transaction that made the change. */
export async function recordAudit(db: Pick<Db, 'insert'>, entry: AuditInput): Promise<void> {
  await db.insert(auditLog).values(row(entry));
}

/** Appends several entries in one statement, in the given order (one transaction, many changes). */
export async function recordAudits(db: Pick<Db, 'insert'>, entries: AuditInput[]): Promise<void> {
  if (entries.length > 0) await db.insert(auditLog).values(entries.map(row));
}
