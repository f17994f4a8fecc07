import type { APIRoute } from 'astro';
import { getApp } from '../../../../lib/server/app';
import { startSession } from '../../../../lib/server/auth';
import { json, problem, readJson } from '../../../../lib/server/http';
import { verifyAgainstDummy, verifyPassword } from '../../../../lib/server/password';
import { signInSchema } from '../../../../schemas/auth';
import { findUserByEmail, normaliseEmail } from '../../../../db/queries/users';
import { recordAudit } from '../../../../db/queries/audit';

/** `{email, password}` → session cookie. Throttled per account and per address. */
export const POST: APIRoute = async (context) => {
  const body = await readJson(context.request, signInSchema);
  if (!body.ok) return body.response;
  const { db, auth, throttle } = await getApp();
  const accountKey = normaliseEmail(body.data.email);
  const addressKey = context.clientAddress;
  const waitMs = Math.max(throttle.account.retryAfterMs(accountKey), throttle.address.retryAfterMs(addressKey));
  if (waitMs > 0) {
    const minutes = Math.ceil(waitMs / 60_000);
    return problem(429, `Too many failed sign-ins. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`, undefined, {
      'retry-after': String(Math.ceil(waitMs / 1000)),
    });
  }
  const user = await findUserByEmail(db, body.data.email);
  const valid = user?.active ? await verifyPassword(user.passwordHash, body.data.password) : await verifyAgainstDummy(body.data.password);
  if (!user || !valid) {
    throttle.account.recordFailure(accountKey);
    throttle.address.recordFailure(addressKey);
    return problem(401, 'The e-mail or password is wrong, or the account is deactivated.');
  }
  throttle.account.reset(accountKey);
  // A fresh session every sign-in; any session the browser brought along ends here.
  if (context.locals.sessionId) await auth.invalidateSession(context.locals.sessionId);
  const { token } = await startSession(auth, user.id);
  const cookie = auth.createSessionCookie(token);
  context.cookies.set(cookie.name, cookie.value, cookie.attributes);
  await recordAudit(db, { actorId: user.id, action: 'user.signed-in', entityType: 'user', entityId: user.id, details: { address: addressKey } });
  return json({ user: { id: user.id, email: user.email, name: user.displayName, role: user.role } });
};
