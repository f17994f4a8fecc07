import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readdirSync } from 'node:fs';
import path from 'node:path';
import { createHash } from 'node:crypto';
import { signIn, startServer, type RunningServer } from '../helpers/server';

let server: RunningServer;
const cookies: Record<string, string> = {};
const ROLES = ['admin', 'architect', 'engineer', 'sales'] as const;
beforeAll(async () => {
  server = await startServer();
  for (const role of ROLES) cookies[role] = await signIn(server.url, `${role}@resetwise.example`);
});
afterAll(async () => {
  await server?.stop();
});

const get = (url: string, role?: string) => fetch(`${server.url}${url}`, { headers: role ? { cookie: cookies[role]! } : {} });
const importSpec = (role: string | undefined, content: string | Uint8Array<ArrayBuffer>, filename: string, fields: Record<string, string> = {}) => {
  const form = new FormData();
  form.append('file', new Blob([content]), filename);
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  return fetch(`${server.url}/api/v1/specs/import`, { method: 'POST', headers: { origin: server.url, ...(role ? { cookie: cookies[role]! } : {}) }, body: form });
};
const specCount = async () => (await (await get('/api/v1/specs', 'admin')).json()).specs.length;
const storedFiles = () => { try { return readdirSync(path.join(server.dataDir, 'uploads')).length; } catch { return 0; } };

const customerJson = JSON.stringify({
  name: 'Shelf converter 48 V to 12 V', customer: 'Fjord Robotics (fictional)',
  vinMinV: '36 V', vinNomV: '48 V', vinMaxV: '75 V', voutV: '12 V', ioutA: '12.5 A', fswHz: '250 kHz',
  annualVolume: '20k', targetEfficiency: '92 %', rectifier: 'synchronous',
});

describe('POST /api/v1/specs/import', () => {
  it('401 without a session; 403 for engineers (they do not create sets)', async () => {
    expect((await importSpec(undefined, customerJson, 'spec.json')).status).toBe(401);
    expect((await importSpec('engineer', customerJson, 'spec.json')).status).toBe(403);
  });

  it('sales import JSON with units: the set is created, evaluated with the current library, and the file kept', async () => {
    const reply = await importSpec('sales', customerJson, 'fjord-rfq.json');
    expect(reply.status).toBe(201);
    const spec = await reply.json();
    expect(spec).toMatchObject({ name: 'Shelf converter 48 V to 12 V', customer: 'Fjord Robotics (fictional)', version: 1 });
    expect(spec.requirements).toMatchObject({ vinMinV: 36, vinMaxV: 75, fswHz: 250e3, annualVolume: 20000, targetEfficiency: 0.92, rectifier: 'synchronous' });
    const comparison = await (await get(`/api/v1/specs/${spec.id}/comparison`, 'engineer')).json();
    expect(comparison.reevaluated).toBe(false);
    expect(comparison.comparison.partsLibrary.version).toBe(String(comparison.libraryVersion));
    for (const role of ROLES) {
      const file = await get(spec.upload.url, role);
      expect(file.status).toBe(200);
      const bytes = Buffer.from(await file.arrayBuffer());
      expect(bytes.toString('utf8')).toBe(customerJson);
      expect(file.headers.get('x-content-sha256')).toBe(createHash('sha256').update(bytes).digest('hex'));
      expect(file.headers.get('content-disposition')).toBe('attachment; filename="fjord-rfq.json"');
    }
    expect((await get(spec.upload.url)).status).toBe(401);
    // Kept in the database with its row (any server process on a shared database serves it), not in the data folder.
    expect(storedFiles()).toBe(0);
    expect((await get('/api/v1/uploads/fjord-rfq.json', 'admin')).status).toBe(404);
    expect((await get(`/api/v1/uploads/${encodeURIComponent('../pg')}`, 'admin')).status).toBe(404);
    const page = await (await get(`/compare/${spec.id}`, 'sales')).text();
    expect(page).toContain('fjord-rfq.json');
  });

  it.each([
    ['two columns field,value', 'field,value\nvinMinV,36 V\nvinNomV,48 V\nvinMaxV,75 V\nvoutV,5 V\nioutA,10 A\nfswHz,200 kHz\n', 'rack.csv'],
    ['a header row and one row of values', 'vinMinV,vinNomV,vinMaxV,voutV,ioutA,fswHz,customer\n18 V,24 V,36 V,5 V,10 A,300k,Nordlys Marine (fictional)\n', 'marine.csv'],
  ])('architects import CSV as %s', async (_what, csv, filename) => {
    const reply = await importSpec('architect', csv, filename, { name: `Imported ${filename}` });
    expect(reply.status).toBe(201);
    const spec = await reply.json();
    expect(spec.name).toBe(`Imported ${filename}`);
    expect(spec.requirements.voutV).toBe(5);
    expect(spec.upload.filename).toBe(filename);
  });

  it.each([
    ['a value with a wrong unit', JSON.stringify({ vinMinV: '36 A', vinNomV: 48, vinMaxV: 75, voutV: 12, ioutA: 5, fswHz: '200 kHz' }), 'x.json', 400, /requirements\.vinMinV: vinMinV: "A" is not a unit of V/],
    ['an unknown field', JSON.stringify({ vinMinV: 36, vinNomV: 48, vinMaxV: 75, voutV: 12, ioutA: 5, fswHz: 2e5, colour: 'red' }), 'x.json', 400, /colour/],
    ['a missing field', 'field,value\nvinMinV,36 V\n', 'x.csv', 400, /requirements\.vinNomV/],
    ['a range the wrong way round', JSON.stringify({ vinMinV: 75, vinNomV: 48, vinMaxV: 36, voutV: 12, ioutA: 5, fswHz: 2e5 }), 'x.json', 400, /vinMinV \(75\) must not exceed vinMaxV \(36\)/],
    ['broken JSON', '{"vinMinV": 36,', 'x.json', 400, /not valid JSON/],
    ['two rows of values', 'vinMinV,vinNomV\n36,48\n18,24\n', 'x.csv', 400, /one requirement set per file/],
    ['a binary file', new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0, 0, 0, 0x0d]), 'x.csv', 415, /not a text file/],
    ['a 3 MB file', `{"pad":"${'x'.repeat(3 * 1024 * 1024)}"}`, 'x.json', 413, /at most 2 MB/],
    ['a PDF', '%PDF-1.4 not really', 'rfq.pdf', 415, /not a \.json or \.csv file/],
  ])('refuses %s with a message; nothing is created or stored', async (_what, content, filename, status, message) => {
    const before = await specCount();
    const files = storedFiles();
    const reply = await importSpec('sales', content, filename);
    expect(reply.status).toBe(status);
    const body = await reply.json();
    expect([body.error, ...(body.fields ?? []).map((f: any) => `${f.field}: ${f.message}`)].join('\n')).toMatch(message);
    expect(await specCount()).toBe(before);
    expect(storedFiles()).toBe(files);
  });
});

describe('GET /api/v1/uploads/:id', () => {
  it('404 for an unknown id; a file is only served through the role check', async () => {
    expect((await get('/api/v1/uploads/AAAAAAAAAAAAAAAAAAAA', 'admin')).status).toBe(404);
    expect((await get('/api/v1/uploads/AAAAAAAAAAAAAAAAAAAA')).status).toBe(401);
    // The data folder is not served as static files.
    expect((await get('/data/uploads', 'admin')).status).toBe(404);
  });
});
