import { createHash, randomBytes } from 'node:crypto';
import { Lucia, TimeSpan } from 'lucia';
import { DrizzlePostgreSQLAdapter } from '@lucia-auth/adapter-drizzle';
import type { Db } from '../../db/client';
import { sessions, users } from '../../db/schema';
import type { Role } from '../roles';

export const SESSION_COOKIE = 'rw_session';
/** Sliding expiry: lucia extends a session used in the second half of this span. */
export const SESSION_LIFETIME = new TimeSpan(12, 'h');

export function createAuth(db: Db, options: { secureCookie: boolean }) {
  return new Lucia(new DrizzlePostgreSQLAdapter(db, sessions, users), {
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
 * (renewed expiry) or cleared (unknown, expired, or the member was deactivated).
 */
export async function validateToken(
  auth: Auth,
  token: string,
): Promise<{ user: SignedInUser | null; renewed: boolean; clear: boolean; expiresAt: Date | null }> {
  const sessionId = sessionIdFromToken(token);
  const { user, session } = await auth.validateSession(sessionId);
  if (!user || !session) return { user: null, renewed: false, clear: true, expiresAt: null };
  if (!user.active) {
    await auth.invalidateUserSessions(user.id);
    return { user: null, renewed: false, clear: true, expiresAt: null };
  }
  return { user, renewed: session.fresh, clear: false, expiresAt: session.expiresAt };
}

/** Starts a fresh session (a new token every sign-in, so a planted id is never reused). */
export async function startSession(auth: Auth, userId: string): Promise<{ token: string; expiresAt: Date }> {
  const token = newSessionToken();
  const session = await auth.createSession(userId, {}, { sessionId: sessionIdFromToken(token) });
  return { token, expiresAt: session.expiresAt };
}
