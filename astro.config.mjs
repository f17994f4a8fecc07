// @ts-check
import { defineConfig, envField } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwindcss from '@tailwindcss/vite';

export default defineConfig({
  output: 'server',
  adapter: node({ mode: 'standalone' }),
  integrations: [react()],
  server: { host: '127.0.0.1', port: 4321 },
  security: {
    checkOrigin: false, // our middleware checks Origin for every write, JSON included
    allowedDomains: [{ hostname: 'localhost' }, { hostname: '127.0.0.1' }, { hostname: '[::1]' }],
  },
  env: {
    schema: {
      DATA_DIR: envField.string({ context: 'server', access: 'public', default: './data' }),
      DATABASE_URL: envField.string({ context: 'server', access: 'secret', optional: true }),
      RESETWISE_DEMO: envField.string({ context: 'server', access: 'public', default: '1' }),
      PUBLIC_ORIGIN: envField.string({ context: 'server', access: 'public', optional: true }),
    },
  },
  vite: { plugins: [tailwindcss()] },
  telemetry: false,
});
