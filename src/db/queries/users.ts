import { asc, eq, sql } from 'drizzle-orm';
import type { Db } from '../client';
import { newId } from '../ids';
import { sessions, users, type User } from '../schema';
import { recordAudit } from './audit';
import type { Role } from '../../lib/roles';

export type PublicUser = Pick<User, 'id' | 'email' | 'displayName' | 'role' | 'active' | 'createdAt' | 'updatedAt'>;

const publicColumns = {
  id: users.id,
  email: users.email,
  displayName: users.displayName,
  role: users.role,
  active: users.active,
  createdAt: users.createdAt,
  updatedAt: users.updatedAt,
};

export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}

export async function listUsers(db: Db): Promise<PublicUser[]> {
  return db.select(publicColumns).from(users).orderBy(asc(users.displayName));
}

export async function findUserByEmail(db: Db, email: string): Promise<User | undefined> {
  const rows = await db.select().from(users).where(eq(users.email, normaliseEmail(email))).limit(1);
  return rows[0];
}

export class DuplicateEmailError extends Error {}

export interface CreateUserInput {
  email: string;
  displayName: string;
  role: Role;
  passwordHash: string;
}

/** Creates a member and records it; throws DuplicateEmailError when the address is taken. */
export async function createUser(db: Db, input: CreateUserInput, actorId: string | null): Promise<PublicUser> {
  const email = normaliseEmail(input.email);
  return db.transaction(async (tx) => {
    const taken = await tx.select({ id: users.id }).from(users).where(eq(users.email, email)).limit(1);
    if (taken.length > 0) throw new DuplicateEmailError(`${email} already belongs to a member`);
    const [row] = await tx
      .insert(users)
      .values({ id: newId(), email, displayName: input.displayName.trim(), role: input.role, passwordHash: input.passwordHash })
      .returning(publicColumns);
    if (!row) throw new Error('insert returned no row');
    await recordAudit(tx, { actorId, action: 'user.created', entityType: 'user', entityId: row.id, details: { email, role: input.role } });
    return row;
  });
}

export class LastAdminError extends Error {}

/**
 * Changes role and/or active flag. Deactivating deletes the member's sessions in the same
 * transaction, so they are signed out at once. The last active admin cannot be demoted or
 * deactivated (the team would lose its only manager).
 */
export async function updateUser(
  db: Db,
  id: string,
  patch: { role?: Role | undefined; active?: boolean | undefined },
  actorId: string,
): Promise<PublicUser | undefined> {
  return db.transaction(async (tx) => {
    const [current] = await tx.select().from(users).where(eq(users.id, id)).limit(1).for('update');
    if (!current) return undefined;
    const losesAdmin = current.role === 'admin' && current.active && (patch.active === false || (patch.role && patch.role !== 'admin'));
    if (losesAdmin) {
      const [count] = await tx
        .select({ n: sql<number>`count(*)::int` })
        .from(users)
        .where(sql`${users.role} = 'admin' and ${users.active}`);
      if ((count?.n ?? 0) <= 1) throw new LastAdminError('the last active admin cannot be demoted or deactivated');
    }
    const [row] = await tx
      .update(users)
      .set({ ...(patch.role ? { role: patch.role } : {}), ...(patch.active !== undefined ? { active: patch.active } : {}), updatedAt: new Date() })
      .where(eq(users.id, id))
      .returning(publicColumns);
    if (patch.active === false) await tx.delete(sessions).where(eq(sessions.userId, id));
    await recordAudit(tx, {
      actorId,
      action: 'user.updated',
      entityType: 'user',
      entityId: id,
      details: { from: { role: current.role, active: current.active }, to: patch },
    });
    return row;
  });
}

/** Members who may be invited to a ballot: active engineers and architects. */
export async function listEligibleVoters(db: Db): Promise<{ id: string; name: string; role: string }[]> {
  return db
    .select({ id: users.id, name: users.displayName, role: users.role })
    .from(users)
    .where(sql`${users.active} and ${users.role} in ('engineer', 'architect')`)
    .orderBy(asc(users.displayName));
}
