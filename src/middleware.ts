import { defineMiddleware } from 'astro:middleware';
import { getApp } from './lib/server/app';
import { SESSION_COOKIE, sessionIdFromToken, validateToken } from './lib/server/auth';
import { config } from './lib/server/config';
import { problem, withHeader } from './lib/server/http';
import { addressProblems } from './lib/server/address-guard';
import { withPageStyles } from './lib/server/page-csp';

const WRITES = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/** Browsers send Origin (or Sec-Fetch-Site) with every write; a foreign one is refused. */
function fromOurOrigin(request: Request, url: URL): boolean {
  const origin = request.headers.get('origin');
  if (origin) return origin === url.origin || origin === config.publicOrigin;
  const site = request.headers.get('sec-fetch-site');
  if (site) return site === 'same-origin' || site === 'none';
  return true; // not a browser: no ambient cookie is being ridden
}

/** Signed-in pages and replies are never kept by a shared cache. */
function finish(response: Response, signedIn: boolean): Response {
  const styled = withPageStyles(response);
  return signedIn && !styled.headers.has('cache-control') ? withHeader(styled, 'cache-control', 'private, no-store') : styled;
}

/**
 * Identifies the user from the session cookie; nothing else is decided here but what holds for every route:
 * addresses with control characters are refused, and writes from foreign origins. The security headers of
 * every reply, the client's address and the body size limit are the HTTP front's (scripts/http).
 */
export const onRequest = defineMiddleware(async (context, next) => {
  const isApi = context.url.pathname.startsWith('/api/');
  context.locals.user = null;
  context.locals.sessionId = null;
  try {
    const address = addressProblems(context.url);
    if (address.kind === 'path') return isApi ? problem(404, 'Nothing has this address.') : context.rewrite('/404');
    if (address.kind === 'query') return isApi ? problem(400, 'Some query parameters are not valid.', address.fields) : context.rewrite('/404');
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
    return finish(response, context.locals.user !== null);
  } catch (error) {
    console.error(`[resetwise] ${context.request.method} ${context.url.pathname} failed:`, error);
    if (isApi) return problem(500, 'Something went wrong on the server. The error was logged.');
    throw error;
  }
});
