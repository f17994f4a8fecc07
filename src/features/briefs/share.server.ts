import { createHash, randomBytes } from 'node:crypto';
import { DEFAULT_SHARE_DAYS } from '../../schemas/briefs';

const TOKEN_BYTES = 32; // 256 bits from the operating system's CSPRNG
const TOKEN_PATTERN = /^[A-Za-z0-9_-]{43}$/;

/** SHA-256 of a share token, hex; the only form the database keeps. */
export function hashShareToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

/** A new share token (base64url, 43 characters) and its hash. */
export function newShareToken(): { token: string; tokenHash: string } {
  const token = randomBytes(TOKEN_BYTES).toString('base64url');
  return { token, tokenHash: hashShareToken(token) };
}

/** Cheap shape check before any database look-up. */
export function looksLikeShareToken(value: string): boolean {
  return TOKEN_PATTERN.test(value);
}

export function shareExpiry(days: number = DEFAULT_SHARE_DAYS, from: Date = new Date()): Date {
  return new Date(from.getTime() + days * 86_400_000);
}

/** The public address of a share page. */
export function shareUrl(origin: string, token: string): string {
  return `${origin.replace(/\/$/, '')}/share/${token}`;
}
