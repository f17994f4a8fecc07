import type { APIContext } from 'astro';
import { getApp } from '../../lib/server/app';
import { startSession } from '../../lib/server/auth';
import { verifyAgainstDummy, verifyPassword } from '../../lib/server/password';
import type { SignInInput } from '../../schemas/auth';
import { findUserByEmail, normaliseEmail } from '../../db/queries/users';
import { recordAudit } from '../../db/queries/audit';

export type SignInOutcome =
  | { ok: true; user: { id: string; email: string; name: string; role: string } }
  | { ok: false; status: 401 | 429; message: string; retryAfterS?: number };

/**
 * Checks the credentials (throttled per account and per address) and, when they hold, ends
 * any session the browser brought along and starts a fresh one (no session fixation).
 */
export async function signIn(context: APIContext, input: SignInInput): Promise<SignInOutcome> {
  const { db, auth, throttle, sessions } = await getApp();
  const accountKey = normaliseEmail(input.email);
  const addressKey = context.clientAddress;
  const waitMs = Math.max(throttle.account.retryAfterMs(accountKey), throttle.address.retryAfterMs(addressKey));
  if (waitMs > 0) {
    const minutes = Math.ceil(waitMs / 60_000);
    return { ok: false, status: 429, message: `Too many failed sign-ins. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`, retryAfterS: Math.ceil(waitMs / 1000) };
  }
  const user = await findUserByEmail(db, input.email);
  const valid = user?.active ? await verifyPassword(user.passwordHash, input.password) : await verifyAgainstDummy(input.password);
  if (!user || !valid) {
    throttle.account.recordFailure(accountKey);
    throttle.address.recordFailure(addressKey);
    return { ok: false, status: 401, message: 'The e-mail or password is wrong, or the account is deactivated.' };
  }
  throttle.account.reset(accountKey);
  if (context.locals.sessionId) await auth.invalidateSession(context.locals.sessionId);
  const signedIn = { id: user.id, email: user.email, displayName: user.displayName, role: user.role, active: user.active };
  const { token } = await startSession(auth, user.id, { cache: sessions, user: signedIn });
  const cookie = auth.createSessionCookie(token);
  context.cookies.set(cookie.name, cookie.value, cookie.attributes);
  await recordAudit(db, { actorId: user.id, action: 'user.signed-in', entityType: 'user', entityId: user.id, details: { address: addressKey } });
  return { ok: true, user: { id: user.id, email: user.email, name: user.displayName, role: user.role } };
}

/** Only same-site paths are followed after sign-in (no open redirect). */
export function safeNext(next: unknown): string {
  return typeof next === 'string' && next.startsWith('/') && !next.startsWith('//') && !next.startsWith('/\\') ? next : '/';
}
