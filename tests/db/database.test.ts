import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { backends } from '../helpers/databases';
import type { Database } from '../../src/db/client';
import { auditLog, sessions, specs, users } from '../../src/db/schema';
import { seedDemo } from '../../src/db/seed';
import { demoAccounts } from '../../src/demo/accounts';
import { demoSpecs } from '../../src/demo/specs';
import { createUser, DuplicateEmailError, LastAdminError, updateUser } from '../../src/db/queries/users';
import { createAuth, sessionIdFromToken, startSession, validateToken } from '../../src/lib/server/auth';
import { verifyPassword } from '../../src/lib/server/password';

// A cheap stand-in hash for seeding speed; real hashing is covered in password.test.ts.
const fakeHash = async (password: string) => `plain:${password}`;

describe.each(backends())('database on $name', (backend) => {
  let database: Database;
  beforeAll(async () => {
    database = await backend.open();
  });
  afterAll(async () => {
    await database?.close();
  });

  it('migrations create every table on an empty database', async () => {
    const rows = await database.db.execute<{ table_name: string }>(
      sql`select table_name from information_schema.tables where table_schema = 'public' order by table_name`,
    );
    const names = (rows as unknown as { rows?: { table_name: string }[] }).rows ?? (rows as unknown as { table_name: string }[]);
    expect(names.map((r) => r.table_name)).toEqual(expect.arrayContaining(['audit_log', 'sessions', 'specs', 'users']));
  });

  it('seeding is idempotent', async () => {
    const first = await seedDemo(database.db, fakeHash);
    expect(first).toEqual({ usersAdded: demoAccounts.length, specsAdded: demoSpecs.length });
    const second = await seedDemo(database.db, fakeHash);
    expect(second).toEqual({ usersAdded: 0, specsAdded: 0 });
    const [{ n: userCount } = { n: 0 }] = await database.db.select({ n: sql<number>`count(*)::int` }).from(users);
    const [{ n: specCount } = { n: 0 }] = await database.db.select({ n: sql<number>`count(*)::int` }).from(specs);
    expect(userCount).toBe(demoAccounts.length);
    expect(specCount).toBe(demoSpecs.length);
    const seededAudits = await database.db.select().from(auditLog).where(eq(auditLog.action, 'demo.seeded'));
    expect(seededAudits).toHaveLength(1);
  });

  it('emails are unique (case-insensitively) and creation is audited', async () => {
    const created = await createUser(database.db, { email: 'New.Member@Example.com', displayName: 'New Member', role: 'engineer', passwordHash: 'x' }, 'demo-admin');
    expect(created.email).toBe('new.member@example.com');
    await expect(
      createUser(database.db, { email: 'new.member@example.COM', displayName: 'Twin', role: 'sales', passwordHash: 'x' }, 'demo-admin'),
    ).rejects.toBeInstanceOf(DuplicateEmailError);
    const audits = await database.db.select().from(auditLog).where(eq(auditLog.entityId, created.id));
    expect(audits.map((a) => a.action)).toEqual(['user.created']);
  });

  it('sessions: created, validated, renewed in the second half of their life, and ended by expiry', async () => {
    const auth = createAuth(database.db, { secureCookie: true });
    const { token } = await startSession(auth, 'demo-engineer');
    const stored = await database.db.select().from(sessions).where(eq(sessions.userId, 'demo-engineer'));
    expect(stored.map((s) => s.id)).toContain(sessionIdFromToken(token));
    expect(stored.map((s) => s.id)).not.toContain(token); // only the hash is stored

    const fresh = await validateToken(auth, token);
    expect(fresh.user?.email).toBe('engineer@resetwise.example');
    expect(fresh.renewed).toBe(false);

    // One hour left of twelve: lucia extends the session.
    const id = sessionIdFromToken(token);
    await database.db.update(sessions).set({ expiresAt: new Date(Date.now() + 3600_000) }).where(eq(sessions.id, id));
    const renewed = await validateToken(auth, token);
    expect(renewed.renewed).toBe(true);
    expect(renewed.expiresAt!.getTime()).toBeGreaterThan(Date.now() + 11 * 3600_000);

    await database.db.update(sessions).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(sessions.id, id));
    const expired = await validateToken(auth, token);
    expect(expired.user).toBeNull();
    expect(expired.clear).toBe(true);
    expect(await database.db.select().from(sessions).where(eq(sessions.id, id))).toHaveLength(0);
  });

  it('the session cookie is httpOnly, SameSite=Lax and Secure in production', async () => {
    const cookie = createAuth(database.db, { secureCookie: true }).createSessionCookie('t').serialize();
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/SameSite=Lax/);
    expect(cookie).toMatch(/Secure/);
  });

  it('deactivating a member ends their sessions at once', async () => {
    const auth = createAuth(database.db, { secureCookie: false });
    const { token } = await startSession(auth, 'demo-engineer2');
    expect((await validateToken(auth, token)).user).not.toBeNull();
    await updateUser(database.db, 'demo-engineer2', { active: false }, 'demo-admin');
    expect(await database.db.select().from(sessions).where(eq(sessions.userId, 'demo-engineer2'))).toHaveLength(0);
    expect((await validateToken(auth, token)).user).toBeNull();
  });

  it('the last active admin cannot be demoted or deactivated', async () => {
    await expect(updateUser(database.db, 'demo-admin', { role: 'engineer' }, 'demo-admin')).rejects.toBeInstanceOf(LastAdminError);
    await expect(updateUser(database.db, 'demo-admin', { active: false }, 'demo-admin')).rejects.toBeInstanceOf(LastAdminError);
    await updateUser(database.db, 'demo-architect', { role: 'admin' }, 'demo-admin');
    const demoted = await updateUser(database.db, 'demo-admin', { role: 'engineer' }, 'demo-architect');
    expect(demoted?.role).toBe('engineer');
  });

  it('the seeded demo password verifies with the real hash', async () => {
    const [row] = await database.db.select().from(users).where(eq(users.id, 'demo-sales'));
    expect(row?.passwordHash).toBe('plain:resetwise-demo');
    expect(await verifyPassword('plain:resetwise-demo', 'resetwise-demo')).toBe(false); // not an argon2 hash
  });
});
