import {
  COOKIE_SECURE, DATABASE_URL, DATA_DIR, HOST, MAIL_FROM, PORT, PUBLIC_ORIGIN, RESETWISE_DEMO,
  SMTP_HOST, SMTP_PASSWORD, SMTP_PORT, SMTP_SECURE, SMTP_USER,
} from 'astro:env/server';

/** A listening address as people type it in a browser: loopback and "every interface" read as localhost. */
function linkHost(host: string): string {
  if (['', '127.0.0.1', '0.0.0.0', '::', '::1', 'localhost'].includes(host)) return 'localhost';
  return host.includes(':') ? `[${host}]` : host;
}

/** The app's run-time configuration, read once from the environment through astro:env. */
export const config = {
  dataDir: DATA_DIR,
  databaseUrl: DATABASE_URL || undefined,
  demo: RESETWISE_DEMO !== '0',
  /** Extra origin allowed to send writes (the public URL behind a reverse proxy). */
  publicOrigin: PUBLIC_ORIGIN || undefined,
  /**
   * Base of every absolute link (share links, mail): PUBLIC_ORIGIN, else the configured host and port. Never the
   * request's Host header, which the sender of the request chooses.
   */
  linkOrigin: (PUBLIC_ORIGIN || `http://${linkHost(HOST)}:${PORT}`).replace(/\/$/, ''),
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
