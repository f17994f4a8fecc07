// Request bodies: read here, before any route or session work, and refused with 413 the moment they pass
// their route's limit — by the declared Content-Length, or while a chunked body streams in. A body over the
// limit is never held: what follows is read and dropped for a moment so the client can read the refusal.
import { readFileSync } from 'node:fs';

const LIMITS_FILE = new URL('../../src/lib/server/body-limits.json', import.meta.url);

/** The limits shared with the routes (src/lib/server/body-limits.json). */
export function loadBodyLimits() {
  return JSON.parse(readFileSync(LIMITS_FILE, 'utf8'));
}

export const METHODS_WITH_BODIES = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

const isUpload = (pathname, limits) => limits.uploadRoutes.includes(pathname.replace(/\/+$/, ''));

/** Largest body `pathname` accepts: uploads take a file plus the multipart framing, every other route JSON. */
export function bodyLimit(pathname, limits) {
  return isUpload(pathname, limits) ? limits.uploadFileBytes + limits.multipartOverheadBytes : limits.jsonBytes;
}

/** The refusal of a body over `pathname`'s limit, in the words of that route. */
export function tooLargeMessage(pathname, limits) {
  return isUpload(pathname, limits)
    ? `The upload is larger than this route accepts: files may be at most ${megabytes(limits.uploadFileBytes)}.`
    : `The body is larger than ${megabytes(limits.jsonBytes)}, the most this route accepts.`;
}

/** `1 MB`, `2.1 MB`: as people say sizes. */
export function megabytes(bytes) {
  const mb = bytes / (bytes % 1_000_000 === 0 ? 1_000_000 : 1024 * 1024);
  return `${Number.isInteger(mb) ? mb : mb.toFixed(1)} MB`;
}

/**
 * Reads `req`'s body up to `limit` bytes.
 * @returns {Promise<{ ok: true, body: Buffer } | { ok: false, reason: 'too-large' | 'aborted' }>}
 */
export function readLimitedBody(req, limit) {
  return new Promise((resolve) => {
    const chunks = [];
    let total = 0;
    const onData = (chunk) => {
      total += chunk.length;
      if (total > limit) {
        finish(); // the stream keeps flowing: Node drops an unread body's data, holding nothing
        resolve({ ok: false, reason: 'too-large' });
        return;
      }
      chunks.push(chunk);
    };
    const onEnd = () => {
      finish();
      resolve({ ok: true, body: Buffer.concat(chunks, total) });
    };
    const onAbort = () => {
      finish();
      resolve({ ok: false, reason: 'aborted' });
    };
    const finish = () => {
      req.off('data', onData);
      req.off('end', onEnd);
      req.off('error', onAbort);
      req.off('aborted', onAbort);
    };
    req.on('data', onData);
    req.on('end', onEnd);
    req.on('error', onAbort);
    req.on('aborted', onAbort);
  });
}

/** The body as the Astro adapter takes one: an async iterable (a Buffer would be re-encoded as JSON). */
export function bodyIterable(body) {
  return {
    async *[Symbol.asyncIterator]() {
      if (body.length > 0) yield body;
    },
  };
}
