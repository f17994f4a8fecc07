import type { APIContext } from 'astro';
import { getApp } from '../../lib/server/app';
import { startSession } from '../../lib/server/auth';
import { verifyAgainstDummy, verifyPassword } from '../../lib/server/password';
import type { SignInInput } from '../../schemas/auth';
import { findUserByEmail, normaliseEmail } from '../../db/queries/users';
import { recordAudit } from '../../db/queries/audit';
import { addressKey, clearSignInFailures, recordSignInFailure, signInVerdict } from '../../lib/server/throttle';

export type SignInOutcome =
  | { ok: true; user: { id: string; email: string; name: string; role: string } }
  | { ok: false; status: 401 | 429; message: string; retryAfterS?: number };

/**
 * Checks the credentials (throttled by the policy of lib/server/throttle.ts) and, when they hold, ends
 * any session the browser brought along and starts a fresh one (no session fixation).
 */
export async function signIn(context: APIContext, input: SignInInput): Promise<SignInOutcome> {
  const { db, auth, sessions } = await getApp();
  const accountKey = normaliseEmail(input.email);
  // The connection's address, or the client a configured trusted proxy names (the HTTP front sets it).
  const address = addressKey(context.clientAddress);
  const verdict = await signInVerdict(db, accountKey, address);
  if (verdict.refuseForMs > 0) {
    const minutes = Math.ceil(verdict.refuseForMs / 60_000);
    return { ok: false, status: 429, message: `Too many failed sign-ins. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`, retryAfterS: Math.ceil(verdict.refuseForMs / 1000) };
  }
  // An account under attack from many addresses is slowed for everyone, the owner included, but never closed.
  if (verdict.delayMs > 0) await new Promise((resolve) => setTimeout(resolve, verdict.delayMs));
  const user = await findUserByEmail(db, input.email);
  const valid = user?.active ? await verifyPassword(user.passwordHash, input.password) : await verifyAgainstDummy(input.password);
  if (!user || !valid) {
    await recordSignInFailure(db, accountKey, address);
    return { ok: false, status: 401, message: 'The e-mail or password is wrong, or the account is deactivated.' };
  }
  await clearSignInFailures(db, accountKey, address);
  if (context.locals.sessionId) await auth.invalidateSession(context.locals.sessionId);
  const signedIn = { id: user.id, email: user.email, displayName: user.displayName, role: user.role, active: user.active };
  const { token } = await startSession(auth, user.id, { cache: sessions, user: signedIn });
  const cookie = auth.createSessionCookie(token);
  context.cookies.set(cookie.name, cookie.value, cookie.attributes);
  await recordAudit(db, { actorId: user.id, action: 'user.signed-in', entityType: 'user', entityId: user.id, details: { address } });
  return { ok: true, user: { id: user.id, email: user.email, name: user.displayName, role: user.role } };
}
