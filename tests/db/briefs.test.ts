import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { backends, seededDemoDatabase } from '../helpers/databases';
import { auditLog, briefShares, candidates, shortlists } from '../../src/db/schema';
import { createBrief, findShare, logShareView, listVersions, recordSend, recordShare, revokeShares } from '../../src/db/queries/briefs';
import { loadBrief, sameContent } from '../../src/features/briefs/service.server';
import { hashShareToken, newShareToken, shareExpiry } from '../../src/features/briefs/share.server';
import { briefMail } from '../../src/features/briefs/mail';
import { briefDraftSchema } from '../../src/schemas/briefs';
import { verdictOf } from '../../src/lib/verdict';
import { createMailer } from '../../src/lib/server/mail';

const DAY_MS = 86_400_000;

describe.each(backends())('briefs on $name', (backend) => {
  const database = seededDemoDatabase(backend);

  const brief = (specId: string, shortlistId: string | null = null) =>
    createBrief(database().db, { specId, shortlistId, title: 'Brief', customerName: 'Nordlicht Telecom (fictional)', customerContact: '', draft: briefDraftSchema.parse({}) }, 'demo-sales');

  it('a decided shortlist sets the recommendation; verdicts still follow the engine', async () => {
    const db = database().db;
    await db.insert(shortlists).values({ id: 'sl-1', specId: 'demo-spec-1', title: 'Brick reset choice', ownerId: 'demo-architect', status: 'voting' });
    await db.insert(candidates).values({ id: 'cand-1', shortlistId: 'sl-1', scheme: 'tertiary-winding', createdById: 'demo-architect' });
    const id = await brief('demo-spec-1', 'sl-1');
    const undecided = (await loadBrief(db, id, { demo: true }))!;
    // Not decided yet: the engine ranking's best feasible scheme (two-switch for this set today).
    expect(undecided.content.recommended?.source).toBe('engine');
    expect(undecided.content.recommended?.scheme).toBe(undecided.comparison.ranking.find((s) => undecided.comparison.results.find((r) => r.scheme === s)!.feasible));
    await db.update(shortlists).set({ status: 'decided', decidedCandidateId: 'cand-1', rationale: 'Lowest risk on the magnetics', decidedAt: new Date() }).where(eq(shortlists.id, 'sl-1'));
    const decided = (await loadBrief(db, id, { demo: true }))!;
    expect(decided.content.recommended).toMatchObject({ scheme: 'tertiary-winding', source: 'shortlist' });
    expect(decided.content.shortlist).toMatchObject({ title: 'Brick reset choice', decidedScheme: 'tertiary-winding', rationale: 'Lowest risk on the magnetics' });
    expect(decided.content.verdicts.map((v) => [v.scheme, v.verdict]).sort()).toEqual(decided.comparison.results.map((r) => [r.scheme, verdictOf(r)]).sort());
    const bom = decided.comparison.results.find((r) => r.scheme === 'tertiary-winding')!.bomCost;
    expect(decided.content.cost?.bomCost).toBe(bom);
  });

  it('share links expire after 30 days by default and on their own expiry date', async () => {
    const db = database().db;
    const id = await brief('demo-spec-3');
    const loaded = (await loadBrief(db, id, { demo: true }))!;
    const { content } = loaded;
    const { token, tokenHash } = newShareToken();
    expect(hashShareToken(token)).toBe(tokenHash);
    const now = new Date();
    const expiresAt = shareExpiry(undefined, now);
    expect(expiresAt.getTime() - now.getTime()).toBe(30 * DAY_MS);
    await recordShare(db, id, content, (latest) => sameContent(latest, content), { tokenHash, expiresAt }, 'demo-sales');
    expect((await findShare(db, tokenHash, now)).kind).toBe('ok');
    expect((await findShare(db, tokenHash, new Date(now.getTime() + 29.9 * DAY_MS))).kind).toBe('ok');
    expect(await findShare(db, tokenHash, new Date(now.getTime() + 30 * DAY_MS))).toEqual({ kind: 'gone', reason: 'expired' });
    // An expiry set in the row (as an operator might) takes effect at once.
    await db.update(briefShares).set({ expiresAt: new Date(now.getTime() - 1000) }).where(eq(briefShares.tokenHash, tokenHash));
    expect(await findShare(db, tokenHash)).toEqual({ kind: 'gone', reason: 'expired' });
    expect(await findShare(db, hashShareToken('not-a-token'))).toEqual({ kind: 'missing' });
  });

  it('only the hash is stored; revoking ends the link; views are logged; changes are audited', async () => {
    const db = database().db;
    const id = await brief('demo-spec-2');
    const content = (await loadBrief(db, id, { demo: true }))!.content;
    const { token, tokenHash } = newShareToken();
    const { version, share } = await recordSend(db, id, content, 'buyer@cobalt-ridge.example', { tokenHash, expiresAt: shareExpiry() }, 'demo-sales');
    expect(version.version).toBe(1);
    const rows = await db.select().from(briefShares).where(eq(briefShares.id, share.id));
    expect(rows[0]!.tokenHash).toBe(tokenHash);
    expect(JSON.stringify(rows)).not.toContain(token);
    await logShareView(db, share.id, '127.0.0.1', 'test agent');
    expect((await listVersions(db, id))[0]!.shares[0]!.views).toBe(1);
    expect(await revokeShares(db, id, 'demo-sales')).toBe(1);
    expect(await findShare(db, tokenHash)).toEqual({ kind: 'gone', reason: 'revoked' });
    expect(await revokeShares(db, id, 'demo-sales')).toBe(0);
    const actions = (await db.select().from(auditLog).where(eq(auditLog.entityId, id))).map((a) => a.action).sort();
    expect(actions).toEqual(['brief.created', 'brief.sent', 'brief.share-revoked']);
  });

  it('sharing an unchanged brief reuses its latest version (content compares after the jsonb round trip)', async () => {
    const db = database().db;
    const id = await brief('demo-spec-1');
    const content = (await loadBrief(db, id, { demo: true }))!.content;
    const same = (latest: typeof content) => sameContent(latest, content);
    const first = await recordShare(db, id, content, same, { tokenHash: newShareToken().tokenHash, expiresAt: shareExpiry() }, 'demo-sales');
    const second = await recordShare(db, id, content, same, { tokenHash: newShareToken().tokenHash, expiresAt: shareExpiry() }, 'demo-sales');
    expect([first.frozeNew, second.frozeNew]).toEqual([true, false]);
    expect(second.version.id).toBe(first.version.id);
    const changed = { ...content, summary: 'Changed.' };
    const third = await recordShare(db, id, changed, (latest) => sameContent(latest, changed), { tokenHash: newShareToken().tokenHash, expiresAt: shareExpiry() }, 'demo-sales');
    expect(third).toMatchObject({ frozeNew: true, version: { version: 2 } });
  });

  it('the brief mail goes out as plain text and HTML, both with the share link', async () => {
    const db = database().db;
    const id = await brief('demo-spec-2');
    const loaded = (await loadBrief(db, id, { demo: true }))!;
    const link = `https://resetwise.example/share/${newShareToken().token}`;
    const mail = briefMail({ content: loaded.content, version: 1, link, expiresAt: shareExpiry(), message: 'Hello <team> & co', senderName: 'Daniel Brandt' });
    expect(mail.text).toContain(link);
    expect(mail.html).toContain(`href="${link}"`);
    expect(mail.html).toContain('Hello &lt;team&gt; &amp; co');
    expect(mail.text).toContain('hazardous voltages');
    expect(mail.text).toContain('Early estimate, not a design');
    const mailer = await createMailer(db, { from: 'Resetwise <noreply@resetwise.example>', capture: true });
    try {
      const row = await mailer.send({ kind: 'brief', to: ['buyer@cobalt-ridge.example'], ...mail, related: { type: 'brief', id } });
      expect(row.status).toBe('captured');
      expect(row.raw).toMatch(/Content-Type: text\/plain/);
      expect(row.raw).toMatch(/Content-Type: text\/html/);
      expect(row.raw).toMatch(/To: buyer@cobalt-ridge.example/);
    } finally {
      await mailer.close();
    }
  });
});
