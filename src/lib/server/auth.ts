import { createHash, randomBytes } from 'node:crypto';
import { Lucia, TimeSpan, type Adapter } from 'lucia';
import { DrizzlePostgreSQLAdapter } from '@lucia-auth/adapter-drizzle';
import type { Db } from '../../db/client';
import { sessions, users } from '../../db/schema';
import type { Role } from '../roles';
import type { SessionCache } from './session-cache';

export const SESSION_COOKIE = 'rw_session';
/** Sliding expiry: lucia extends a session used in the second half of this span. */
export const SESSION_LIFETIME = new TimeSpan(12, 'h');

/**
 * The lucia adapter, with every session deletion and expiry change also evicting the cached
 * entry (sign-out, sign-in over an old cookie, a deactivated member's sessions, renewal).
 */
function evictingAdapter(inner: Adapter, cache: SessionCache | undefined): Adapter {
  if (!cache) return inner;
  return {
    getSessionAndUser: (sessionId) => inner.getSessionAndUser(sessionId),
    getUserSessions: (userId) => inner.getUserSessions(userId),
    setSession: (session) => inner.setSession(session),
    updateSessionExpiration: async (sessionId, expiresAt) => {
      cache.forgetSession(sessionId);
      await inner.updateSessionExpiration(sessionId, expiresAt);
    },
    deleteSession: async (sessionId) => {
      cache.forgetSession(sessionId);
      await inner.deleteSession(sessionId);
    },
    deleteUserSessions: async (userId) => {
      cache.forgetUser(userId);
      await inner.deleteUserSessions(userId);
    },
    deleteExpiredSessions: async () => {
      cache.forgetAll();
      await inner.deleteExpiredSessions();
    },
  };
}

export function createAuth(db: Db, options: { secureCookie: boolean; sessionCache?: SessionCache }) {
  return new Lucia(evictingAdapter(new DrizzlePostgreSQLAdapter(db, sessions, users), options.sessionCache), {
    sessionExpiresIn: SESSION_LIFETIME,
    sessionCookie: {
      name: SESSION_COOKIE,
      attributes: { sameSite: 'lax', secure: options.secureCookie, path: '/' },
    },
    getUserAttributes: (row) => ({
      email: row.email,
      displayName: row.displayName,
      role: row.role,
      active: row.active,
    }),
  });
}
export type Auth = ReturnType<typeof createAuth>;

declare module 'lucia' {
  interface Register {
    Lucia: Auth;
    DatabaseUserAttributes: { email: string; displayName: string; role: Role; active: boolean };
  }
}

/** 160 bits from the CSPRNG; this goes in the cookie and is never stored. */
export function newSessionToken(): string {
  return randomBytes(20).toString('base64url');
}

/** The stored session id: SHA-256 of the token, so a database leak yields no usable cookie. */
export function sessionIdFromToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

export type SignedInUser = { id: string; email: string; displayName: string; role: Role; active: boolean };

/**
 * Validates a cookie token. Returns the user and whether the cookie must be re-sent
 * (renewed expiry) or cleared (unknown, expired, or the member was deactivated). With a
 * `cache`, a session confirmed earlier and still before its renewal point is answered without
 * the database (the same answer lucia would give; see SessionCache).
 */
export async function validateToken(
  auth: Auth,
  token: string,
  cache?: SessionCache,
): Promise<{ user: SignedInUser | null; renewed: boolean; clear: boolean; expiresAt: Date | null }> {
  const sessionId = sessionIdFromToken(token);
  const hit = cache?.get(sessionId);
  if (hit) return { user: hit.user, renewed: false, clear: false, expiresAt: hit.expiresAt };
  const generation = cache?.generation() ?? 0;
  const { user, session } = await auth.validateSession(sessionId);
  if (!user || !session) return { user: null, renewed: false, clear: true, expiresAt: null };
  if (!user.active) {
    await auth.invalidateUserSessions(user.id);
    return { user: null, renewed: false, clear: true, expiresAt: null };
  }
  // A renewal evicted the entry (generation moved); the next request caches the new expiry.
  cache?.put(sessionId, user, session.expiresAt, generation);
  return { user, renewed: session.fresh, clear: false, expiresAt: session.expiresAt };
}

/**
 * Starts a fresh session (a new token every sign-in, so a planted id is never reused). With
 * `remember`, the new session goes straight into the cache: this process has just written it, so
 * the member's first request needs no lookup.
 */
export async function startSession(
  auth: Auth,
  userId: string,
  remember?: { cache: SessionCache; user: SignedInUser },
): Promise<{ token: string; expiresAt: Date }> {
  const token = newSessionToken();
  const sessionId = sessionIdFromToken(token);
  const generation = remember?.cache.generation() ?? 0;
  const session = await auth.createSession(userId, {}, { sessionId });
  if (remember && remember.user.id === userId) remember.cache.put(sessionId, remember.user, session.expiresAt, generation);
  return { token, expiresAt: session.expiresAt };
}
