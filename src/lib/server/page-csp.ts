import { withHeader } from './http';

/**
 * Astro (experimental.csp in astro.config.mjs) sends each page's Content-Security-Policy with the SHA-256 of
 * every inline script it renders (the island loader and the client directives), so no script runs inline but
 * those. It lists style hashes too, and a style-src holding a hash ignores 'unsafe-inline', which would drop the
 * style attributes React renders on the server (each scheme's colour swatch): those attributes cannot be hashed.
 * Styles cannot run code, so the page's style-src is set to the app's own sheets plus inline styles.
 */
export const PAGE_STYLE_SRC = "style-src 'self' 'unsafe-inline'";

export function withPageStyles(response: Response): Response {
  const policy = response.headers.get('content-security-policy');
  if (!policy || !/(^|;)\s*style-src\s/.test(policy)) return response;
  const rewritten = policy
    .split(';')
    .map((directive) => directive.trim())
    .filter((directive) => directive !== '')
    .map((directive) => (directive.startsWith('style-src ') ? PAGE_STYLE_SRC : directive))
    .join('; ');
  return withHeader(response, 'content-security-policy', rewritten);
}
