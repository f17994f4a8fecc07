import { COOKIE_SECURE, DATABASE_URL, DATA_DIR, PUBLIC_ORIGIN, RESETWISE_DEMO } from 'astro:env/server';

/** The app's run-time configuration, read once from the environment through astro:env. */
export const config = {
  dataDir: DATA_DIR,
  databaseUrl: DATABASE_URL || undefined,
  demo: RESETWISE_DEMO !== '0',
  /** Extra origin allowed to send writes (the public URL behind a reverse proxy). */
  publicOrigin: PUBLIC_ORIGIN || undefined,
  /** `auto`: Secure cookies in production builds, plain in `astro dev`. */
  secureCookie: COOKIE_SECURE === 'auto' ? import.meta.env.PROD : COOKIE_SECURE === '1',
} as const;
