import { createHash, randomBytes } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import type { UploadRecord } from '../../db/queries/parts';
import { config } from './config';
import { problem } from './http';
import { CONTROL_CHARACTER, controlMessage, firstControl } from '../text-guard';
import limits from './body-limits.json';

/** Largest file accepted by any upload route. */
export const MAX_UPLOAD_BYTES = limits.uploadFileBytes;

export interface ReceivedFile {
  filename: string;
  mimeType: string;
  bytes: Uint8Array;
  /** The content decoded as UTF-8 (text files only reach the caller). */
  text: string;
  sha256: string;
}

const megabytes = (bytes: number): string => `${(bytes / (1024 * 1024)).toFixed(1)} MB`;

/** Display name of an uploaded file: no folders, no control characters, at most 120 characters. */
export function cleanFilename(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? '';
  const clean = base.replace(/[\u0000-\u001f\u007f"]/g, '').trim().slice(0, 120);
  return clean || 'upload';
}

/**
 * Reads one text file from a multipart body (form field `file`). Refuses, with a plain message:
 * other content types, no file, files over 2 MB, extensions outside `extensions`, and
 * content that is not UTF-8 text (NUL bytes or invalid sequences, as in spreadsheets and images).
 */
export async function receiveTextFile(request: Request, extensions: readonly string[]): Promise<{ ok: true; file: ReceivedFile; form: FormData } | { ok: false; response: Response }> {
  const fail = (status: number, message: string) => ({ ok: false as const, response: problem(status, message) });
  const type = request.headers.get('content-type') ?? '';
  if (!type.toLowerCase().startsWith('multipart/form-data')) return fail(400, 'Send the file as multipart/form-data in a field named "file".');
  const declared = Number(request.headers.get('content-length') ?? '0');
  if (declared > MAX_UPLOAD_BYTES + limits.multipartOverheadBytes) return fail(413, `The upload is ${megabytes(declared)}; files may be at most 2 MB.`);
  let form: FormData;
  try {
    form = await request.formData();
  } catch {
    return fail(400, 'The multipart body could not be read; send the file in a field named "file".');
  }
  const file = form.get('file');
  if (!(file instanceof File)) return fail(400, 'No file: send it in a form field named "file".');
  if (file.size === 0) return fail(400, 'The file is empty.');
  if (file.size > MAX_UPLOAD_BYTES) return fail(413, `The file is ${megabytes(file.size)}; files may be at most 2 MB.`);
  const filename = cleanFilename(file.name);
  const extension = path.extname(filename).slice(1).toLowerCase();
  if (!extensions.includes(extension)) {
    return fail(415, `"${filename}" is not a ${extensions.map((e) => `.${e}`).join(' or ')} file. ${extension === 'xlsx' || extension === 'xls' ? 'Save the sheet as CSV (comma-separated) first.' : ''}`.trim());
  }
  const bytes = new Uint8Array(await file.arrayBuffer());
  if (bytes.includes(0)) return fail(415, `"${filename}" is not a text file (it holds binary data).`);
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return fail(415, `"${filename}" is not UTF-8 text. Save it as CSV UTF-8 and try again.`);
  }
  // The one boundary of every upload: no control character reaches a text column or jsonb from a file or a form field.
  const control = firstControl(text);
  if (control) {
    const line = text.slice(0, text.search(CONTROL_CHARACTER)).split('\n').length;
    return fail(415, `"${filename}" holds a control character (${control}) on line ${line}; save it as plain text and try again.`);
  }
  for (const [field, value] of form.entries()) {
    const found = typeof value === 'string' ? firstControl(value) : null;
    if (found) return { ok: false as const, response: problem(400, 'Some fields are not valid.', [{ field, message: controlMessage(field, found) }]) };
  }
  const mimeType = extension === 'json' ? 'application/json' : 'text/csv';
  return { ok: true, form, file: { filename, mimeType, bytes, text, sha256: createHash('sha256').update(bytes).digest('hex') } };
}

const STORED_NAME = /^[a-f0-9]{48}$/;
const legacyUploadDir = (): string => path.resolve(config.dataDir, 'uploads');

/**
 * The row to record for a received file, its content included: it is stored in the database with the row
 * it belongs to, in the same transaction, so a refused or failed write leaves nothing behind, and every
 * server process on a shared database can serve it. `storedName` is a random unique name for the row.
 */
export function uploadRecord(file: ReceivedFile): UploadRecord {
  return { filename: file.filename, sizeBytes: file.bytes.byteLength, mimeType: file.mimeType, sha256: file.sha256, storedName: randomBytes(24).toString('hex'), content: Buffer.from(file.bytes) };
}

/**
 * An upload's content: from its row, or for rows written before content was kept there, from the file its
 * stored name gives under DATA_DIR/uploads (the name must be one of ours, never a path).
 */
export async function uploadContent(upload: { content: Buffer | null; storedName: string }, legacyDir = legacyUploadDir()): Promise<Buffer> {
  if (upload.content) return upload.content;
  if (!STORED_NAME.test(upload.storedName)) throw new Error('not a stored upload name');
  return readFile(path.join(legacyDir, upload.storedName));
}
