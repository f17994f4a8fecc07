import type { APIRoute } from 'astro';
import { getApp } from '../../../../lib/server/app';
import { json } from '../../../../lib/server/http';

/** Ends the session on the server and clears the cookie. A plain form post is sent back to sign-in. */
export const POST: APIRoute = async (context) => {
  const { auth } = await getApp();
  if (context.locals.sessionId) await auth.invalidateSession(context.locals.sessionId);
  const blank = auth.createBlankSessionCookie();
  context.cookies.set(blank.name, blank.value, blank.attributes);
  const wantsPage = (context.request.headers.get('accept') ?? '').includes('text/html');
  return wantsPage ? context.redirect('/sign-in?signedOut=1', 303) : json({ signedOut: true });
};
