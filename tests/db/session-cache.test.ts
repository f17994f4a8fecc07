import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { backends, seededDemoDatabase } from '../helpers/databases';
import { sessions } from '../../src/db/schema';
import { createAuth, SESSION_LIFETIME, sessionIdFromToken, startSession, validateToken, type SignedInUser } from '../../src/lib/server/auth';
import { SessionCache } from '../../src/lib/server/session-cache';

// Sessions through lucia with the per-process cache (issue #8): every way a session ends on the
// server also ends it in the cache, and a renewal still reaches the database.

const engineer: SignedInUser = { id: 'demo-engineer', email: 'engineer@resetwise.example', displayName: 'x', role: 'engineer', active: true };

describe.each(backends())('cached sessions on $name', (backend) => {
  const database = seededDemoDatabase(backend);

  function setup() {
    const cache = new SessionCache({ lifetimeMs: SESSION_LIFETIME.milliseconds(), maxAgeMs: null, maxEntries: 100 });
    return { cache, auth: createAuth(database().db, { secureCookie: false, sessionCache: cache }) };
  }

  it('sign-out (invalidateSession) ends a cached session at once', async () => {
    const { cache, auth } = setup();
    const { token } = await startSession(auth, 'demo-engineer');
    expect((await validateToken(auth, token, cache)).user?.role).toBe('engineer');
    expect(cache.size).toBe(1);
    await auth.invalidateSession(sessionIdFromToken(token));
    expect((await validateToken(auth, token, cache)).user).toBeNull();
  });

  it('ending all of a member\'s sessions ends the cached ones', async () => {
    const { cache, auth } = setup();
    const first = await startSession(auth, 'demo-engineer2');
    const second = await startSession(auth, 'demo-engineer2');
    await validateToken(auth, first.token, cache);
    await validateToken(auth, second.token, cache);
    await auth.invalidateUserSessions('demo-engineer2');
    expect((await validateToken(auth, first.token, cache)).user).toBeNull();
    expect((await validateToken(auth, second.token, cache)).user).toBeNull();
  });

  it('a session started with `remember` is answered from the cache; one in its second half is renewed in the database', async () => {
    const { cache, auth } = setup();
    const { token } = await startSession(auth, 'demo-engineer', { cache, user: engineer });
    expect(cache.get(sessionIdFromToken(token))?.user.id).toBe('demo-engineer');
    const id = sessionIdFromToken(token);
    // Move the stored expiry into the second half and evict, as a renewal point reached would.
    await database().db.update(sessions).set({ expiresAt: new Date(Date.now() + 3600_000) }).where(eq(sessions.id, id));
    cache.forgetSession(id);
    const renewed = await validateToken(auth, token, cache);
    expect(renewed.renewed).toBe(true);
    const [row] = await database().db.select().from(sessions).where(eq(sessions.id, id));
    expect(row!.expiresAt.getTime()).toBeGreaterThan(Date.now() + 11 * 3600_000);
    // The renewal evicted the entry; the next request caches the new expiry and needs no renewal.
    const next = await validateToken(auth, token, cache);
    expect(next.renewed).toBe(false);
    expect(cache.get(id)?.expiresAt.getTime()).toBe(row!.expiresAt.getTime());
  });
});
