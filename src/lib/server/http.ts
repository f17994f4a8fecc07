import type { z } from 'zod';
import { controlCharactersIn, MAX_JSON_DEPTH, nestsDeeperThan } from '../text-guard';
import limits from './body-limits.json';

export interface FieldProblem {
  field: string;
  message: string;
}

/**
 * A JSON reply; API replies are never cached. The body goes out as UTF-8 bytes with its length:
 * a string body would be re-scanned and re-encoded by the Response class (≈ 8 % of the CPU time
 * of a 52 KB comparison), and a known length spares the chunked framing.
 */
export function json(data: unknown, status = 200, headers: Record<string, string> = {}): Response {
  const bytes = Buffer.from(JSON.stringify(data), 'utf8');
  return new Response(bytes, {
    status,
    headers: { 'content-type': 'application/json; charset=utf-8', 'content-length': String(bytes.byteLength), 'cache-control': 'no-store', ...headers },
  });
}

/** An error reply: `{ error, fields? }` with a plain-English message and no internals. */
export function problem(status: number, message: string, fields?: FieldProblem[], headers?: Record<string, string>): Response {
  return json(fields && fields.length > 0 ? { error: message, fields } : { error: message }, status, headers);
}

/** Turns zod issues into one plain line per field. */
export function fieldProblems(error: z.ZodError): FieldProblem[] {
  return error.issues.map((issue) => ({
    field: issue.path.length > 0 ? issue.path.map(String).join('.') : '(body)',
    message: issue.message,
  }));
}

/** Largest JSON body of any route (the HTTP front refuses larger ones before they reach a route). */
export const MAX_JSON_BYTES = limits.jsonBytes;

/**
 * A request body as text, read chunk by chunk and abandoned as soon as it passes `maxBytes`: a body over the limit
 * is never held whole (the HTTP front in scripts/http refuses it earlier still; this holds under `astro dev`).
 */
export async function readBodyText(request: Request, maxBytes: number): Promise<{ ok: true; text: string } | { ok: false; response: Response }> {
  const tooLarge = { ok: false as const, response: problem(413, `The body is larger than ${megabytes(maxBytes)}, the most this route accepts.`) };
  if (Number(request.headers.get('content-length') ?? '0') > maxBytes) return tooLarge;
  if (!request.body) return { ok: true, text: '' };
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => undefined);
      return tooLarge;
    }
    chunks.push(value);
  }
  return { ok: true, text: Buffer.concat(chunks, total).toString('utf8') };
}

/** `1 MB`, `2 MB`: the size limits as people say them. */
export function megabytes(bytes: number): string {
  const mb = bytes / (bytes % 1_000_000 === 0 ? 1_000_000 : 1024 * 1024);
  return `${Number.isInteger(mb) ? mb : mb.toFixed(1)} MB`;
}

/**
 * JSON text → value, refusing what no route accepts before any schema sees it: nesting deeper than
 * MAX_JSON_DEPTH (the schemas recurse), text that is not JSON, and control characters in any string or key
 * (PostgreSQL refuses U+0000 in text and jsonb). Shared by JSON bodies and uploaded JSON files.
 */
export function parseJsonText(text: string, what = 'The body'): { ok: true; value: unknown } | { ok: false; response: Response } {
  if (nestsDeeperThan(text, MAX_JSON_DEPTH)) {
    return { ok: false, response: problem(400, `${what} nests deeper than ${MAX_JSON_DEPTH} levels; no Resetwise request needs more than a few.`) };
  }
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    return { ok: false, response: problem(400, `${what} is not valid JSON.`) };
  }
  const controls = controlCharactersIn(value);
  if (controls.length > 0) return { ok: false, response: problem(400, 'Some fields are not valid.', controls) };
  return { ok: true, value };
}

/**
 * Reads and validates a JSON body (`emptyAs`: the value an empty body stands for). Any failure (wrong content type, too large, too deep, not JSON, control
 * characters, schema violations) becomes a 4xx reply naming each bad field.
 */
export async function readJson<S extends z.ZodType>(
  request: Request,
  schema: S,
  options: { emptyAs?: unknown } = {},
): Promise<{ ok: true; data: z.output<S> } | { ok: false; response: Response }> {
  const type = request.headers.get('content-type') ?? '';
  const body = await readBodyText(request, MAX_JSON_BYTES);
  if (!body.ok) return body;
  // `emptyAs`: routes whose every field is optional also take no body at all, with any content type.
  const empty = 'emptyAs' in options && body.text.trim() === '';
  if (!empty && !type.toLowerCase().includes('application/json')) {
    return { ok: false, response: problem(400, 'Send the body as JSON with Content-Type: application/json.') };
  }
  const raw = empty ? { ok: true as const, value: options.emptyAs } : parseJsonText(body.text);
  if (!raw.ok) return raw;
  const parsed = schema.safeParse(raw.value);
  if (!parsed.success) {
    return { ok: false, response: problem(400, 'Some fields are not valid.', fieldProblems(parsed.error)) };
  }
  return { ok: true, data: parsed.data };
}

/**
 * `response` with one header set. Some responses (redirects, fetched ones) carry immutable headers: those are
 * copied into a new response first.
 */
export function withHeader(response: Response, name: string, value: string): Response {
  try {
    response.headers.set(name, value);
    return response;
  } catch {
    const copy = new Response(response.body, response);
    copy.headers.set(name, value);
    return copy;
  }
}
