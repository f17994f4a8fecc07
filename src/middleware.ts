import { defineMiddleware } from 'astro:middleware';
import { getApp } from './lib/server/app';
import { SESSION_COOKIE, sessionIdFromToken, validateToken } from './lib/server/auth';
import { config } from './lib/server/config';
import { problem } from './lib/server/http';

const WRITES = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

const SECURITY_HEADERS: Record<string, string> = {
  // Nothing is loaded from anywhere but this server (fonts ship with the app).
  'content-security-policy':
    "default-src 'self'; script-src 'self' 'unsafe-inline'; style-src 'self' 'unsafe-inline'; img-src 'self' data:; font-src 'self'; connect-src 'self'; frame-ancestors 'none'; base-uri 'self'; form-action 'self'",
  'x-content-type-options': 'nosniff',
  'referrer-policy': 'same-origin',
  'x-frame-options': 'DENY',
};

/** Browsers send Origin (or Sec-Fetch-Site) with every write; a foreign one is refused. */
function fromOurOrigin(request: Request, url: URL): boolean {
  const origin = request.headers.get('origin');
  if (origin) return origin === url.origin || origin === config.publicOrigin;
  const site = request.headers.get('sec-fetch-site');
  if (site) return site === 'same-origin' || site === 'none';
  return true; // not a browser: no ambient cookie is being ridden
}

function withSecurityHeaders(response: Response, signedIn: boolean): Response {
  // Some responses (redirects) come with immutable headers; copy those first.
  const out = Object.isFrozen(response.headers) ? new Response(response.body, response) : response;
  try {
    for (const [name, value] of Object.entries(SECURITY_HEADERS)) out.headers.set(name, value);
    if (signedIn && !out.headers.has('cache-control')) out.headers.set('cache-control', 'private, no-store');
    return out;
  } catch {
    const copy = new Response(response.body, response);
    for (const [name, value] of Object.entries(SECURITY_HEADERS)) copy.headers.set(name, value);
    return copy;
  }
}

/** Identifies the user from the session cookie; nothing else is decided here. */
export const onRequest = defineMiddleware(async (context, next) => {
  const isApi = context.url.pathname.startsWith('/api/');
  context.locals.user = null;
  context.locals.sessionId = null;
  try {
    if (WRITES.has(context.request.method) && !fromOurOrigin(context.request, context.url)) {
      return problem(403, 'Writes are accepted only from pages served by this Resetwise server.');
    }
    const token = context.cookies.get(SESSION_COOKIE)?.value;
    if (token) {
      const { auth, sessions } = await getApp();
      const result = await validateToken(auth, token, sessions);
      if (result.user) {
        context.locals.user = result.user;
        context.locals.sessionId = sessionIdFromToken(token);
        if (result.renewed) {
          const cookie = auth.createSessionCookie(token);
          context.cookies.set(cookie.name, cookie.value, cookie.attributes);
        }
      } else {
        const blank = auth.createBlankSessionCookie();
        context.cookies.set(blank.name, blank.value, blank.attributes);
      }
    }
    const response = await next();
    if (isApi && response.status === 404 && !response.headers.get('content-type')?.includes('json')) {
      return problem(404, 'No such API route.');
    }
    return withSecurityHeaders(response, context.locals.user !== null);
  } catch (error) {
    console.error(`[resetwise] ${context.request.method} ${context.url.pathname} failed:`, error);
    if (isApi) return problem(500, 'Something went wrong on the server. The error was logged.');
    throw error;
  }
});
