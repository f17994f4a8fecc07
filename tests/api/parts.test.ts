import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
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

const call = (method: string, path: string, role?: string, body?: unknown) =>
  fetch(`${server.url}${path}`, {
    method,
    headers: { 'content-type': 'application/json', origin: server.url, ...(role ? { cookie: cookies[role]! } : {}) },
    ...(body !== undefined ? { body: JSON.stringify(body) } : {}),
  });
const upload = (path: string, role: string | undefined, content: string | Uint8Array<ArrayBuffer>, filename = 'parts.csv', type = 'text/csv') => {
  const form = new FormData();
  form.append('file', new Blob([content], { type }), filename);
  return fetch(`${server.url}${path}`, { method: 'POST', headers: { origin: server.url, ...(role ? { cookie: cookies[role]! } : {}) }, body: form });
};
const library = async () => (await (await call('GET', '/api/v1/parts', 'engineer')).json()) as { version: number; library: Record<string, any> };
const exportCsv = async (query = '') => (await call('GET', `/api/v1/parts/export.csv${query}`, 'sales')).text();
const telecom = JSON.parse(readFileSync('examples/telecom-brick-36-75v-12v.json', 'utf8'));
const twoSwitch = async () => ((await (await call('POST', '/api/v1/evaluate', 'engineer', telecom)).json()) as any);

describe('reading the library', () => {
  it('401 without a session; every role reads version 1 seeded from the invented demo parts', async () => {
    expect((await call('GET', '/api/v1/parts')).status).toBe(401);
    for (const role of ROLES) {
      const reply = await call('GET', '/api/v1/parts', role);
      expect(reply.status).toBe(200);
      const body = await reply.json();
      expect(body.version).toBe(1);
      expect(body.library).toMatchObject({ name: 'Halvard demo parts (invented)', version: '1', currency: 'EUR', demo: true });
      expect(body.library.mosfets.length).toBeGreaterThan(10);
    }
  });

  it('the engine output names the database version of the library it used', async () => {
    const comparison = await twoSwitch();
    expect(comparison.partsLibrary).toEqual({ name: 'Halvard demo parts (invented)', version: '1', currency: 'EUR', demo: true });
  });

  it('every role sees the history and exports CSV (whole, one category, an earlier version); bad queries are 400/404', async () => {
    for (const role of ROLES) {
      expect((await call('GET', '/api/v1/parts/history', role)).status).toBe(200);
      const csv = await call('GET', '/api/v1/parts/export.csv?category=cores', role);
      expect(csv.status).toBe(200);
      expect(csv.headers.get('content-type')).toMatch(/text\/csv/);
      expect(csv.headers.get('content-disposition')).toMatch(/parts-library-v\d+-cores\.csv/);
    }
    expect((await call('GET', '/api/v1/parts/export.csv')).status).toBe(401);
    expect((await call('GET', '/api/v1/parts/export.csv?category=thyristors', 'sales')).status).toBe(400);
    expect((await call('GET', '/api/v1/parts/export.csv?version=999', 'sales')).status).toBe(404);
  });
});

describe('API document', () => {
  it('lists every parts, import and upload route', async () => {
    const doc = await (await call('GET', '/api/v1/openapi.json', 'sales')).json();
    for (const route of ['/parts', '/parts/{id}', '/parts/import', '/parts/export.csv', '/parts/history', '/specs/import', '/uploads/{id}']) expect(doc.paths[route]).toBeDefined();
    expect(Object.keys(doc.paths['/parts/{id}'])).toEqual(['put', 'delete']);
    expect(doc.paths['/parts/import'].post.requestBody.content['multipart/form-data']).toBeDefined();
  });
});

describe('CSV import', () => {
  it('only admins import (401, 403 for the others)', async () => {
    const csv = await exportCsv();
    expect((await upload('/api/v1/parts/import?dryRun=1', undefined, csv)).status).toBe(401);
    for (const role of ['architect', 'engineer', 'sales']) expect((await upload('/api/v1/parts/import?dryRun=1', role, csv)).status).toBe(403);
  });

  it('export → import gives no changes, and applying it writes no new version', async () => {
    const before = await library();
    const csv = await exportCsv();
    const dry = await (await upload('/api/v1/parts/import?dryRun=1', 'admin', csv)).json();
    expect(dry.preview.changes).toEqual([]);
    expect(dry.preview.errors).toEqual([]);
    expect(dry.preview.unchanged).toBe(dry.preview.rows);
    expect(dry.canApply).toBe(false);
    const applied = await upload('/api/v1/parts/import', 'admin', csv);
    expect(applied.status).toBe(200);
    expect((await applied.json()).changes).toEqual([]);
    expect((await library()).version).toBe(before.version);
  });

  describe('bad files are refused with a message and change nothing', () => {
    const lines = async () => (await exportCsv()).trimEnd().split('\n');
    const withCell = (header: string, line: string, column: string, value: string) => {
      const cells = line.split(',');
      cells[header.split(',').indexOf(column)] = value;
      return cells.join(',');
    };
    it.each([
      ['a wrong header', async () => 'part number,voltage\nx,650\n', 400, /Wrong header/],
      ['a 3 MB file', async () => `${(await lines())[0]}\n${'x'.repeat(3 * 1024 * 1024)}\n`, 413, /at most 2 MB/],
      ['a binary file', async () => new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0, 0, 0, 0, 0x14, 0]), 415, /not a text file/],
      ['formula-injection strings', async () => { const [h, l] = await lines(); return `${h}\n${withCell(h!, l!, 'description', '=HYPERLINK("http://x.example")')}\n`; }, 400, /line 2: description "=HYPERLINK\("http:\/\/x" starts like a spreadsheet formula/],
      ['duplicate ids', async () => { const [h, l] = await lines(); return `${h}\n${l}\n${l}\n`; }, 400, /appears again \(first on line 2\)/],
      ['negative prices', async () => { const [h, l] = await lines(); return `${h}\n${withCell(h!, l!, 'tier2Price', '-0.5')}\n`; }, 400, /unit price must not be negative/],
      ['an unknown category', async () => { const [h, l] = await lines(); return `${h}\n${l!.replace(',mosfets,', ',valves,')}\n`; }, 400, /unknown category "valves"/],
      ['a non-numeric field', async () => { const [h, l] = await lines(); return `${h}\n${withCell(h!, l!, 'vdsV', 'forty')}\n`; }, 400, /vdsV "forty" is not a number/],
    ])('%s', async (_what, make, status, message) => {
      const before = await library();
      const historyBefore = (await (await call('GET', '/api/v1/parts/history', 'admin')).json()).versions.length;
      const content = await make();
      for (const query of ['?dryRun=1', '']) {
        const reply = await upload(`/api/v1/parts/import${query}`, 'admin', content);
        const body = await reply.json();
        if (query === '' || status !== 400 || !body.preview) {
          expect(reply.status).toBe(status);
          expect([body.error, ...(body.fields ?? []).map((f: any) => `${f.field}: ${f.message}`)].join('\n')).toMatch(message);
        } else {
          expect(reply.status).toBe(200); // the preview lists the row errors
          expect(body.canApply).toBe(false);
          expect(body.preview.errors.map((e: any) => `line ${e.line}: ${e.message}`).join('\n')).toMatch(message);
        }
      }
      expect(await library()).toEqual(before);
      expect((await (await call('GET', '/api/v1/parts/history', 'admin')).json()).versions.length).toBe(historyBefore);
    });

    it('a spreadsheet file is refused by name', async () => {
      const reply = await upload('/api/v1/parts/import?dryRun=1', 'admin', 'not really', 'parts.xlsx', 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
      expect(reply.status).toBe(415);
      expect((await reply.json()).error).toMatch(/Save the sheet as CSV/);
    });
  });

  it('preview then apply: one new version with who/what, the file kept and downloadable by every role', async () => {
    const before = await library();
    const [header, ...rows] = (await exportCsv('?category=capacitors')).trimEnd().split('\n');
    const added = rows[0]!.replace(/demo-cap-[^,]+/, 'halvard-cap-ceramic-10uf-50v');
    const retired = `retire${rows[1]!}`;
    const csv = `${header}\n${added}\n${retired}\n`;
    const dry = await (await upload('/api/v1/parts/import?dryRun=1', 'admin', csv, 'caps.csv')).json();
    expect(dry.preview.changes.map((c: any) => [c.op, c.line])).toEqual([['add', 2], ['retire', 3]]);
    expect(await library()).toEqual(before); // the preview changed nothing
    const stale = await upload(`/api/v1/parts/import?baseVersion=${before.version - 1 || 999}`, 'admin', csv, 'caps.csv');
    expect(stale.status).toBe(409);
    const reply = await upload(`/api/v1/parts/import?baseVersion=${before.version}`, 'admin', csv, 'caps.csv');
    expect(reply.status).toBe(200);
    const applied = await reply.json();
    expect(applied.version).toBe(before.version + 1);
    const after = await library();
    expect(after.library.capacitors.map((c: any) => c.id)).toContain('halvard-cap-ceramic-10uf-50v');
    expect(after.library.capacitors).toHaveLength(before.library.capacitors.length);
    const history = (await (await call('GET', '/api/v1/parts/history', 'sales')).json()).versions;
    const admin = await (await call('GET', '/api/v1/auth/me', 'admin')).json();
    expect(history[0]).toMatchObject({ version: applied.version, by: admin.user.name, upload: { filename: 'caps.csv' } });
    expect(history[0].summary).toMatch(/CSV import of caps\.csv: 1 added, 1 retired/);
    expect(history[0].changes).toHaveLength(2);
    for (const role of ROLES) {
      const file = await call('GET', history[0].upload.url, role);
      expect(file.status).toBe(200);
      expect(file.headers.get('content-disposition')).toMatch(/attachment; filename="caps\.csv"/);
      expect(await file.text()).toBe(csv);
    }
    expect((await call('GET', history[0].upload.url)).status).toBe(401);
    const old = await exportCsv(`?version=${before.version}`);
    expect(old).toContain(rows[1]!.split(',')[2]!); // the retired part is still in the earlier version
  });
});

describe('editing parts (admins)', () => {
  const mosfet = { id: 'halvard-nmos-120v-a', description: 'Trench FET, TO-220 class', status: 'allowed', channel: 'n', vdsV: 120, idA: 40, rdsOnOhm: 0.012, qgC: 40e-9, cossF: 300e-12, tiers: [{ minQty: 1, unitPrice: 1.1 }, { minQty: 10000, unitPrice: 0.7 }] };

  it('others get 403 on every write; 401 without a session', async () => {
    expect((await call('POST', '/api/v1/parts', undefined, { category: 'mosfets', part: mosfet })).status).toBe(401);
    for (const role of ['architect', 'engineer', 'sales']) {
      expect((await call('POST', '/api/v1/parts', role, { category: 'mosfets', part: mosfet })).status).toBe(403);
      expect((await call('PUT', '/api/v1/parts/demo-nmos-100v-a', role, { part: mosfet })).status).toBe(403);
      expect((await call('DELETE', '/api/v1/parts/demo-nmos-100v-a', role)).status).toBe(403);
    }
  });

  it('400 names each bad field; nothing is written', async () => {
    const before = await library();
    const reply = await call('POST', '/api/v1/parts', 'admin', { category: 'mosfets', part: { ...mosfet, vdsV: -5, description: '=cmd|x', colour: 'red', tiers: [{ minQty: 1, unitPrice: -1 }] } });
    expect(reply.status).toBe(400);
    const text = JSON.stringify(await reply.json());
    expect(text).toMatch(/unknown field\(s\) for a MOSFET: colour/);
    const second = await (await call('POST', '/api/v1/parts', 'admin', { category: 'mosfets', part: { ...mosfet, vdsV: -5, description: '=cmd|x', tiers: [{ minQty: 1, unitPrice: -1 }] } })).json();
    const messages = second.fields.map((f: any) => `${f.field}: ${f.message}`).join('\n');
    expect(messages).toMatch(/part\.vdsV: vdsV must be greater than zero/);
    expect(messages).toMatch(/part\.description: description must not start with = \+ - @/);
    expect(messages).toMatch(/unit price must not be negative/);
    expect((await call('POST', '/api/v1/parts', 'admin', { category: 'valves', part: mosfet })).status).toBe(400);
    expect(await library()).toEqual(before);
  });

  it('add (201), duplicate (409), edit (200), stale edit (409), retire (200) — each a version', async () => {
    const start = (await library()).version;
    const created = await call('POST', '/api/v1/parts', 'admin', { category: 'mosfets', part: mosfet, baseVersion: start });
    expect(created.status).toBe(201);
    expect((await created.json()).version).toBe(start + 1);
    expect((await call('POST', '/api/v1/parts', 'admin', { category: 'srMosfets', part: mosfet })).status).toBe(409);
    const edited = await call('PUT', `/api/v1/parts/${mosfet.id}`, 'admin', { part: { ...mosfet, status: 'nfnd' }, baseVersion: start + 1 });
    expect(edited.status).toBe(200);
    const edit = await edited.json();
    expect(edit.changes[0].fields).toEqual({ status: { from: 'allowed', to: 'nfnd' } });
    expect((await call('PUT', `/api/v1/parts/${mosfet.id}`, 'admin', { part: mosfet, baseVersion: start })).status).toBe(409);
    expect((await call('PUT', `/api/v1/parts/${mosfet.id}`, 'admin', { part: { ...mosfet, id: 'renamed' } })).status).toBe(400);
    expect((await call('PUT', '/api/v1/parts/no-such-part', 'admin', { part: mosfet })).status).toBe(404);
    expect((await call('DELETE', `/api/v1/parts/${mosfet.id}`, 'admin')).status).toBe(200);
    expect((await call('DELETE', `/api/v1/parts/${mosfet.id}`, 'admin')).status).toBe(404);
    const history = (await (await call('GET', '/api/v1/parts/history', 'engineer')).json()).versions;
    expect(history.slice(0, 3).map((v: any) => v.summary)).toEqual(['1 retired (MOSFET)', '1 changed (MOSFET)', '1 added (MOSFET)']);
    expect(history[0].by).toBe(history[1].by);
  });

  it('refuses to retire the last gate driver of a kind the engine could choose… of the whole category', async () => {
    const { library: lib } = await library();
    const ids = lib.gateDrivers.map((d: any) => d.id);
    for (const id of ids.slice(0, -1)) expect((await call('DELETE', `/api/v1/parts/${id}`, 'admin')).status).toBe(200);
    const last = await call('DELETE', `/api/v1/parts/${ids.at(-1)}`, 'admin');
    expect(last.status).toBe(400);
    expect(JSON.stringify(await last.json())).toMatch(/Gate drivers would have no part left/);
  });
});

describe('the library drives every server evaluation', () => {
  // Derived: a part with the chosen part's ratings at half its price qualifies wherever the
  // original did, so the engine's cheapest-qualifying rule (DESIGN.md, step 4) must pick it.
  it('adding a cheaper qualifying MOSFET changes the engine choice and the BOM cost', async () => {
    const before = (await twoSwitch()).results.find((r: any) => r.scheme === 'two-switch');
    const chosenId = before.details.mainSwitchId;
    const { library: lib, version } = await library();
    const chosen = lib.mosfets.find((m: any) => m.id === chosenId);
    const cheap = { ...chosen, id: 'halvard-nmos-value', description: 'value line', tiers: chosen.tiers.map((t: any) => ({ ...t, unitPrice: t.unitPrice / 2 })) };
    expect((await call('POST', '/api/v1/parts', 'admin', { category: 'mosfets', part: cheap })).status).toBe(201);
    const comparison = await twoSwitch();
    const after = comparison.results.find((r: any) => r.scheme === 'two-switch');
    expect(comparison.partsLibrary.version).toBe(String(version + 1));
    expect(after.details.mainSwitchId).toBe('halvard-nmos-value');
    const line = before.parts.find((l: any) => l.partId === chosenId);
    const newLine = after.parts.find((l: any) => l.partId === 'halvard-nmos-value');
    expect(newLine.qty).toBe(line.qty);
    expect(newLine.unitPrice).toBeCloseTo(line.unitPrice / 2, 9);
    expect(after.bomCost).toBeCloseTo(before.bomCost - line.qty * (line.unitPrice - newLine.unitPrice), 9);
  });

  it('a saved set reports "parts library changed" until re-evaluated; ?fresh=1 uses the current version', async () => {
    const created = await (await call('POST', '/api/v1/specs', 'architect', { name: 'Library drift check', requirements: telecom })).json();
    const first = await (await call('GET', `/api/v1/specs/${created.id}/comparison`, 'sales')).json();
    expect(first.libraryChanged).toBe(false);
    const savedWith = first.comparison.partsLibrary.version;
    expect(savedWith).toBe(String(first.libraryVersion));
    const { library: lib } = await library();
    const cap = lib.capacitors[0];
    expect((await call('PUT', `/api/v1/parts/${cap.id}`, 'admin', { part: { ...cap, description: 'reviewed' } })).status).toBe(200);
    const stale = await (await call('GET', `/api/v1/specs/${created.id}/comparison`, 'sales')).json();
    expect(stale).toMatchObject({ libraryChanged: true, storedLibraryVersion: savedWith, libraryVersion: Number(savedWith) + 1, reevaluated: false });
    expect(stale.notice).toMatch(/Parts library changed since this result/);
    const fresh = await (await call('GET', `/api/v1/specs/${created.id}/comparison?fresh=1`, 'sales')).json();
    expect(fresh).toMatchObject({ libraryChanged: false, reevaluated: true });
    expect(fresh.comparison.partsLibrary.version).toBe(String(Number(savedWith) + 1));
  });
});
