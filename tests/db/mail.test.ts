import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openDatabase, type Database } from '../../src/db/client';
import { createMailer, type Mailer } from '../../src/lib/server/mail';

let database: Database;
let mailer: Mailer;
beforeAll(async () => {
  database = await openDatabase({ dataDir: 'memory://' });
  mailer = await createMailer(database.db, { from: 'Resetwise <noreply@resetwise.example>', capture: true });
});
afterAll(async () => {
  await mailer?.close();
  await database?.close();
});

describe('mail through the local capture server', () => {
  it('sends over SMTP with both parts and records the captured message', async () => {
    expect(mailer.mode).toBe('capture');
    const row = await mailer.send({
      kind: 'test', to: ['a@example.com'], cc: ['b@example.com'], subject: 'Voting opens: 48 V brick',
      text: 'Plain part', html: '<p>HTML part</p>', related: { type: 'shortlist', id: 's1' },
    });
    expect(row.status).toBe('captured');
    expect(row.toAddresses).toBe('a@example.com');
    expect(row.raw).toMatch(/Subject: Voting opens: 48 V brick/);
    expect(row.raw).toMatch(/Content-Type: text\/plain/);
    expect(row.raw).toMatch(/Content-Type: text\/html/);
    expect(row.raw).toMatch(/To: a@example.com/);
  });

  it('records a failure when no server is configured', async () => {
    const off = await createMailer(database.db, { from: 'x@example.com', capture: false });
    const row = await off.send({ kind: 'test', to: ['a@example.com'], subject: 's', text: 't', html: '<p>t</p>' });
    expect(row.status).toBe('failed');
    expect(row.error).toMatch(/No SMTP server/);
  });
});
