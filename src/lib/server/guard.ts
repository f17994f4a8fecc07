import type { AstroGlobal, APIContext } from 'astro';
import { can, type Capability } from '../roles';
import type { SignedInUser } from './auth';
import { problem } from './http';

type Locals = App.Locals;

/**
 * The one role check every endpoint uses, in the order 401 (no user) → 403 (role).
 * Returns the user, or the reply to send. Validation (400) and throttling (429) follow in the handler.
 */
export function authorize(locals: Locals, capability?: Capability): SignedInUser | Response {
  const user = locals.user;
  if (!user) return problem(401, 'Sign in first.');
  if (capability && !can(user.role, capability)) {
    return problem(403, 'Your role does not allow this.');
  }
  return user;
}

/**
 * The same check for pages: no user → redirect to sign-in (coming back afterwards);
 * wrong role → the 403 page.
 */
export async function authorizePage(astro: AstroGlobal | APIContext, capability?: Capability): Promise<SignedInUser | Response> {
  const user = astro.locals.user;
  if (!user) {
    const next = astro.url.pathname + astro.url.search;
    return astro.redirect(`/sign-in?next=${encodeURIComponent(next)}`, 302);
  }
  if (capability && !can(user.role, capability)) {
    return astro.rewrite('/403');
  }
  return user;
}
