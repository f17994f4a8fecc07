/**
 * The page to open after sign-in, from an untrusted `next` (a query parameter or form field): a path on this
 * server, or `/` (the home screen). `next` is resolved against `origin` with the URL parser — the way a browser
 * will resolve the redirect — and kept only when it starts with a single `/` and the result is on the same
 * origin. The parser drops tab and newline and reads `\` as `/`, so `/%09/evil.example` and `/\evil.example`
 * resolve to another host and are refused. The one check of the sign-in page, its API and its form.
 *
 * @example safeNext('/compare/demo-spec-1?x=1', 'http://localhost:4321') // '/compare/demo-spec-1?x=1'
 * @example safeNext('/\t/evil.example', 'http://localhost:4321') // '/'
 */
export function safeNext(next: unknown, origin: string): string {
  if (typeof next !== 'string' || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return '/';
  let base: URL;
  let resolved: URL;
  try {
    base = new URL(origin);
    resolved = new URL(next, base);
  } catch {
    return '/';
  }
  if (resolved.origin !== base.origin) return '/';
  const path = `${resolved.pathname}${resolved.search}${resolved.hash}`;
  return path.startsWith('/') && !path.startsWith('//') ? path : '/';
}
