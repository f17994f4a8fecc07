import type { APIRoute } from 'astro';
import { json, problem, readJson } from '../../../../lib/server/http';
import { signInSchema } from '../../../../schemas/auth';
import { signIn } from '../../../../features/auth/sign-in.server';
import { safeNext } from '../../../../lib/next-path';

const isForm = (request: Request): boolean => (request.headers.get('content-type') ?? '').includes('application/x-www-form-urlencoded');

/**
 * `{email, password}` → session cookie (JSON). The sign-in page's form also posts here as a
 * plain form before its script has loaded; that gets redirects instead of JSON.
 */
export const POST: APIRoute = async (context) => {
  if (isForm(context.request)) {
    const form = await context.request.formData();
    const next = safeNext(form.get('next'), context.url.origin);
    const parsed = signInSchema.safeParse({ email: form.get('email'), password: form.get('password') });
    const back = (error: string) => context.redirect(`/sign-in?error=${error}&next=${encodeURIComponent(next)}`, 303);
    if (!parsed.success) return back('invalid');
    const outcome = await signIn(context, parsed.data);
    if (!outcome.ok) return back(outcome.status === 429 ? 'throttled' : 'credentials');
    return context.redirect(next, 303);
  }
  const body = await readJson(context.request, signInSchema);
  if (!body.ok) return body.response;
  const outcome = await signIn(context, body.data);
  if (!outcome.ok) {
    return problem(outcome.status, outcome.message, undefined, outcome.retryAfterS ? { 'retry-after': String(outcome.retryAfterS) } : undefined);
  }
  return json({ user: outcome.user });
};
