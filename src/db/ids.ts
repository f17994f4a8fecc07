import { randomBytes } from 'node:crypto';

/** A random, URL-safe id (120 bits) for rows whose ids appear in links. */
export function newId(): string {
  return randomBytes(15).toString('base64url');
}
