// Headers on every reply the server sends: pages, JSON, refusals, redirects, static files. Pages replace the
// Content-Security-Policy below with Astro's own (astro.config.mjs, experimental.csp), which adds the hashes
// of the few inline scripts Astro writes; both are built from CSP_DIRECTIVES.

/** The directives every policy shares: nothing is loaded from anywhere but this server; no framing. */
export const CSP_DIRECTIVES = /** @type {const} */ ([
  "default-src 'self'",
  "img-src 'self' data:",
  "font-src 'self'",
  "connect-src 'self'",
  "worker-src 'self'",
  "object-src 'none'",
  "frame-ancestors 'none'",
  "base-uri 'self'",
  "form-action 'self'",
]);

/** HSTS for a year once a client has reached us over HTTPS (not preloaded: that is the operator's choice). */
export const HSTS = 'max-age=31536000; includeSubDomains';

/**
 * @param {{ https: boolean }} request whether the client reached us over HTTPS (directly, or as a trusted proxy says)
 * @returns {Record<string, string>}
 */
export function securityHeaders({ https }) {
  return {
    'content-security-policy': CSP_DIRECTIVES.join('; '),
    'x-content-type-options': 'nosniff',
    'x-frame-options': 'DENY',
    'referrer-policy': 'same-origin',
    'cross-origin-opener-policy': 'same-origin',
    ...(https ? { 'strict-transport-security': HSTS } : {}),
  };
}
