import {
  COOKIE_SECURE, DATABASE_URL, DATA_DIR, MAIL_FROM, PORT, PUBLIC_ORIGIN, RESETWISE_DEMO,
  SMTP_HOST, SMTP_PASSWORD, SMTP_PORT, SMTP_SECURE, SMTP_USER,
} from 'astro:env/server';

/** The app's run-time configuration, read once from the environment through astro:env. */
export const config = {
  dataDir: DATA_DIR,
  databaseUrl: DATABASE_URL || undefined,
  demo: RESETWISE_DEMO !== '0',
  /** Extra origin allowed to send writes (the public URL behind a reverse proxy). */
  publicOrigin: PUBLIC_ORIGIN || undefined,
  /** Base of absolute links in e-mail: PUBLIC_ORIGIN, else this server on localhost. */
  linkOrigin: (PUBLIC_ORIGIN || `http://localhost:${PORT}`).replace(/\/$/, ''),
  /** `auto`: Secure cookies in production builds, plain in `astro dev`. */
  secureCookie: COOKIE_SECURE === 'auto' ? import.meta.env.PROD : COOKIE_SECURE === '1',
  mail: {
    host: SMTP_HOST || undefined,
    port: SMTP_PORT,
    user: SMTP_USER || undefined,
    password: SMTP_PASSWORD || undefined,
    secure: SMTP_SECURE === '1',
    from: MAIL_FROM,
    /** Demo and development mode capture mail locally instead of sending it. */
    capture: RESETWISE_DEMO !== '0' || import.meta.env.DEV,
  },
} as const;
