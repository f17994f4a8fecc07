// @ts-check
import { defineConfig, envField } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwindcss from '@tailwindcss/vite';
import { databaseTemplate } from './scripts/db-template.mjs';
import { CSP_DIRECTIVES } from './scripts/http/security-headers.mjs';

export default defineConfig({
  output: 'server',
  // Middleware mode: the build starts no server itself; scripts/serve.mjs runs it behind the HTTP front
  // (client address, body limits, security headers, graceful stop).
  adapter: node({ mode: 'middleware' }),
  integrations: [react(), databaseTemplate()],
  server: { host: '127.0.0.1', port: 4321 },
  security: {
    checkOrigin: false, // our middleware checks Origin for every write, JSON included
    allowedDomains: [{ hostname: 'localhost' }, { hostname: '127.0.0.1' }, { hostname: '[::1]' }],
  },
  env: {
    schema: {
      // All read at run time (secret fields are not inlined into the build).
      DATA_DIR: envField.string({ context: 'server', access: 'secret', default: './data' }),
      DATABASE_URL: envField.string({ context: 'server', access: 'secret', optional: true }),
      RESETWISE_DEMO: envField.enum({ context: 'server', access: 'secret', values: ['0', '1'], default: '1' }),
      PUBLIC_ORIGIN: envField.string({ context: 'server', access: 'secret', optional: true }),
      COOKIE_SECURE: envField.enum({ context: 'server', access: 'secret', values: ['auto', '0', '1'], default: 'auto' }),
      SMTP_HOST: envField.string({ context: 'server', access: 'secret', optional: true }),
      SMTP_PORT: envField.number({ context: 'server', access: 'secret', optional: true }),
      SMTP_USER: envField.string({ context: 'server', access: 'secret', optional: true }),
      SMTP_PASSWORD: envField.string({ context: 'server', access: 'secret', optional: true }),
      SMTP_SECURE: envField.enum({ context: 'server', access: 'secret', values: ['0', '1'], default: '0' }),
      HOST: envField.string({ context: 'server', access: 'secret', default: '127.0.0.1' }),
      PORT: envField.number({ context: 'server', access: 'secret', default: 4321 }),
      MAIL_FROM: envField.string({ context: 'server', access: 'secret', default: 'Resetwise <noreply@resetwise.example>' }),
    },
  },
  vite: { plugins: [tailwindcss()] },
  experimental: {
    // Each page's Content-Security-Policy header with the hash of every inline script Astro writes, so pages
    // need no 'unsafe-inline' for scripts (src/lib/server/page-csp.ts sets their style-src).
    csp: { algorithm: 'SHA-256', directives: [...CSP_DIRECTIVES] },
  },
});
