import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { uploadContent, uploadRecord, type ReceivedFile } from '../../src/lib/server/uploads';

const dir = mkdtempSync(path.join(tmpdir(), 'resetwise-uploads-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('upload content', () => {
  const file: ReceivedFile = { filename: 'rfq.csv', mimeType: 'text/csv', bytes: new TextEncoder().encode('\ufeffvinMinV,36 V\n'), text: 'vinMinV,36 V\n', sha256: 'x' };

  it('a new upload carries its bytes in the row, exactly as received (a byte-order mark included), under a fresh random name', async () => {
    const a = uploadRecord(file), b = uploadRecord(file);
    expect(a.content.equals(Buffer.from(file.bytes))).toBe(true);
    expect(a.sizeBytes).toBe(file.bytes.byteLength);
    expect(a.storedName).toMatch(/^[a-f0-9]{48}$/);
    expect(b.storedName).not.toBe(a.storedName);
    expect(await uploadContent(a, dir)).toBe(a.content);
  });

  it('a row from before contents were kept in the database is read from its file in the uploads folder; a name that is not ours is refused', async () => {
    const storedName = 'ab'.repeat(24);
    mkdirSync(dir, { recursive: true });
    writeFileSync(path.join(dir, storedName), 'legacy,file\n');
    expect((await uploadContent({ content: null, storedName }, dir)).toString('utf8')).toBe('legacy,file\n');
    await expect(uploadContent({ content: null, storedName: '../pg/PG_VERSION' }, dir)).rejects.toThrow(/not a stored upload name/);
  });
});
