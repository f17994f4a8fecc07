import { and, desc, eq, isNull, max, sql } from 'drizzle-orm';
import type { Db } from '../client';
import { newId } from '../ids';
import { briefs, briefShares, briefShareViews, briefVersions, candidates, shortlists, specs, users, type Brief, type BriefShare, type BriefVersion } from '../schema';
import { recordAudit } from './audit';

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

export interface BriefRow extends Brief {
  createdByName: string;
  specName: string;
  latestVersion: number | null;
  lastSentAt: Date | null;
}

const latest = (db: Db) => db.select({ briefId: briefVersions.briefId, version: max(briefVersions.version).as('latest_version'), sentAt: max(briefVersions.sentAt).as('last_sent_at') }).from(briefVersions).groupBy(briefVersions.briefId).as('latest');

function rowQuery(db: Db) {
  const l = latest(db);
  return db
    .select({ brief: briefs, createdByName: users.displayName, specName: specs.name, latestVersion: l.version, lastSentAt: l.sentAt })
    .from(briefs)
    .innerJoin(users, eq(users.id, briefs.createdById))
    .innerJoin(specs, eq(specs.id, briefs.specId))
    .leftJoin(l, eq(l.briefId, briefs.id));
}

const toRow = (r: { brief: Brief; createdByName: string; specName: string; latestVersion: number | null; lastSentAt: Date | string | null }): BriefRow => ({
  ...r.brief, createdByName: r.createdByName, specName: r.specName, latestVersion: r.latestVersion,
  // max() over a timestamp comes back as text from some drivers
  lastSentAt: r.lastSentAt === null ? null : new Date(r.lastSentAt),
});

/** Briefs, newest change first; of one requirement set when `specId` is given. */
export async function listBriefs(db: Db, options: { specId?: string | undefined } = {}): Promise<BriefRow[]> {
  const rows = await rowQuery(db).where(options.specId ? eq(briefs.specId, options.specId) : undefined).orderBy(desc(briefs.updatedAt)).limit(500);
  return rows.map(toRow);
}

export async function getBrief(db: Db, id: string): Promise<BriefRow | undefined> {
  const rows = await rowQuery(db).where(eq(briefs.id, id)).limit(1);
  return rows[0] ? toRow(rows[0]) : undefined;
}

export interface BriefInsert {
  specId: string;
  shortlistId: string | null;
  title: string;
  customerName: string;
  customerContact: string;
  draft: Brief['draft'];
}

export async function createBrief(db: Db, input: BriefInsert, actorId: string): Promise<string> {
  const id = newId();
  await db.transaction(async (tx) => {
    await tx.insert(briefs).values({ id, ...input, createdById: actorId });
    await recordAudit(tx, { actorId, action: 'brief.created', entityType: 'brief', entityId: id, details: { specId: input.specId, shortlistId: input.shortlistId } });
  });
  return id;
}

export async function updateBrief(db: Db, id: string, input: { title: string; customerName: string; customerContact: string; draft: Brief['draft'] }, actorId: string): Promise<boolean> {
  return db.transaction(async (tx) => {
    const rows = await tx.update(briefs).set({ ...input, updatedAt: new Date() }).where(eq(briefs.id, id)).returning({ id: briefs.id });
    if (rows.length === 0) return false;
    await recordAudit(tx, { actorId, action: 'brief.updated', entityType: 'brief', entityId: id });
    return true;
  });
}

/** The decided shortlist behind a brief, read straight from the shortlist tables. */
export interface DecidedShortlist {
  id: string;
  specId: string;
  title: string;
  status: string;
  decidedScheme: string | null;
  decidedOverrides: Record<string, unknown> | null;
  rationale: string | null;
}

export async function getShortlistForBrief(db: Db, id: string): Promise<DecidedShortlist | undefined> {
  const rows = await db
    .select({ id: shortlists.id, specId: shortlists.specId, title: shortlists.title, status: shortlists.status, rationale: shortlists.rationale, decidedScheme: candidates.scheme, decidedOverrides: candidates.overrides })
    .from(shortlists)
    .leftJoin(candidates, eq(candidates.id, shortlists.decidedCandidateId))
    .where(eq(shortlists.id, id))
    .limit(1);
  return rows[0];
}

export interface ShareSummary {
  id: string;
  createdAt: Date;
  expiresAt: Date;
  revokedAt: Date | null;
  views: number;
  lastViewAt: Date | null;
}

export interface VersionWithShares extends BriefVersion {
  sentByName: string | null;
  shares: ShareSummary[];
}

/** Frozen versions, newest first, each with its share links and how often they were opened. */
export async function listVersions(db: Db, briefId: string): Promise<VersionWithShares[]> {
  const versions = await db
    .select({ version: briefVersions, sentByName: users.displayName })
    .from(briefVersions)
    .leftJoin(users, eq(users.id, briefVersions.sentById))
    .where(eq(briefVersions.briefId, briefId))
    .orderBy(desc(briefVersions.version));
  const shares = await db
    .select({
      share: briefShares,
      views: sql<number>`count(${briefShareViews.id})::int`,
      lastViewAt: sql<Date | string | null>`max(${briefShareViews.at})`,
    })
    .from(briefShares)
    .innerJoin(briefVersions, eq(briefVersions.id, briefShares.briefVersionId))
    .leftJoin(briefShareViews, eq(briefShareViews.shareId, briefShares.id))
    .where(eq(briefVersions.briefId, briefId))
    .groupBy(briefShares.id)
    .orderBy(desc(briefShares.createdAt));
  return versions.map(({ version, sentByName }) => ({
    ...version,
    sentByName,
    shares: shares
      .filter((s) => s.share.briefVersionId === version.id)
      .map((s) => ({ id: s.share.id, createdAt: s.share.createdAt, expiresAt: s.share.expiresAt, revokedAt: s.share.revokedAt, views: Number(s.views), lastViewAt: s.lastViewAt === null ? null : new Date(s.lastViewAt) })),
  }));
}

async function nextVersion(tx: Tx, briefId: string): Promise<number> {
  const [row] = await tx.select({ v: max(briefVersions.version) }).from(briefVersions).where(eq(briefVersions.briefId, briefId));
  return (row?.v ?? 0) + 1;
}

async function insertVersion(tx: Tx, briefId: string, content: BriefVersion['content'], sent: { to: string; byId: string } | null): Promise<BriefVersion> {
  const [row] = await tx
    .insert(briefVersions)
    .values({ id: newId(), briefId, version: await nextVersion(tx, briefId), content, sentTo: sent?.to ?? '', sentById: sent?.byId ?? null, sentAt: sent ? new Date() : null })
    .returning();
  return row!;
}

async function insertShare(tx: Tx, versionId: string, tokenHash: string, expiresAt: Date, actorId: string): Promise<BriefShare> {
  const [row] = await tx.insert(briefShares).values({ id: newId(), briefVersionId: versionId, tokenHash, createdById: actorId, expiresAt }).returning();
  return row!;
}

export interface ShareGrant {
  tokenHash: string;
  expiresAt: Date;
}

/** A send: freezes the version that goes out and its share link, with one audit entry. */
export async function recordSend(db: Db, briefId: string, content: BriefVersion['content'], sentTo: string, grant: ShareGrant, actorId: string): Promise<{ version: BriefVersion; share: BriefShare }> {
  return db.transaction(async (tx) => {
    const version = await insertVersion(tx, briefId, content, { to: sentTo, byId: actorId });
    const share = await insertShare(tx, version.id, grant.tokenHash, grant.expiresAt, actorId);
    await tx.update(briefs).set({ updatedAt: new Date() }).where(eq(briefs.id, briefId));
    await recordAudit(tx, { actorId, action: 'brief.sent', entityType: 'brief', entityId: briefId, details: { version: version.version, to: sentTo, shareId: share.id } });
    return { version, share };
  });
}

/**
 * A share link to the latest version, freezing a new (unsent) version first when the brief
 * has none yet or its content changed since (`sameAsLatest` decides).
 */
export async function recordShare(db: Db, briefId: string, content: BriefVersion['content'], sameAsLatest: (latest: BriefVersion['content']) => boolean, grant: ShareGrant, actorId: string): Promise<{ version: BriefVersion; share: BriefShare; frozeNew: boolean }> {
  return db.transaction(async (tx) => {
    const [latestRow] = await tx.select().from(briefVersions).where(eq(briefVersions.briefId, briefId)).orderBy(desc(briefVersions.version)).limit(1);
    const frozeNew = !latestRow || !sameAsLatest(latestRow.content);
    const version = frozeNew ? await insertVersion(tx, briefId, content, null) : latestRow;
    const share = await insertShare(tx, version.id, grant.tokenHash, grant.expiresAt, actorId);
    await recordAudit(tx, { actorId, action: 'brief.shared', entityType: 'brief', entityId: briefId, details: { version: version.version, shareId: share.id, expiresAt: grant.expiresAt.toISOString() } });
    return { version, share, frozeNew };
  });
}

/** Revokes the brief's active links (or one of them); returns how many were revoked. */
export async function revokeShares(db: Db, briefId: string, actorId: string, shareId?: string): Promise<number> {
  return db.transaction(async (tx) => {
    const versionIds = tx.select({ id: briefVersions.id }).from(briefVersions).where(eq(briefVersions.briefId, briefId));
    const rows = await tx
      .update(briefShares)
      .set({ revokedAt: new Date() })
      .where(and(sql`${briefShares.briefVersionId} in ${versionIds}`, isNull(briefShares.revokedAt), shareId ? eq(briefShares.id, shareId) : undefined))
      .returning({ id: briefShares.id });
    if (rows.length > 0) await recordAudit(tx, { actorId, action: 'brief.share-revoked', entityType: 'brief', entityId: briefId, details: { shareIds: rows.map((r) => r.id) } });
    return rows.length;
  });
}

export type ShareLookup =
  | { kind: 'ok'; share: BriefShare; version: BriefVersion }
  | { kind: 'gone'; reason: 'revoked' | 'expired' }
  | { kind: 'missing' };

/** The share behind a token hash, if it is still live at `now`. */
export async function findShare(db: Db, tokenHash: string, now: Date = new Date()): Promise<ShareLookup> {
  const rows = await db
    .select({ share: briefShares, version: briefVersions })
    .from(briefShares)
    .innerJoin(briefVersions, eq(briefVersions.id, briefShares.briefVersionId))
    .where(eq(briefShares.tokenHash, tokenHash))
    .limit(1);
  const row = rows[0];
  if (!row) return { kind: 'missing' };
  if (row.share.revokedAt !== null) return { kind: 'gone', reason: 'revoked' };
  if (row.share.expiresAt.getTime() <= now.getTime()) return { kind: 'gone', reason: 'expired' };
  return { kind: 'ok', ...row };
}

/** Logs one view of a share link. */
export async function logShareView(db: Db, shareId: string, address: string, userAgent: string): Promise<void> {
  await db.insert(briefShareViews).values({ shareId, address: address.slice(0, 100), userAgent: userAgent.slice(0, 400) });
}


/** Decided shortlists (id, title, spec) a brief can start from. */
export async function listDecidedShortlists(db: Db): Promise<{ id: string; title: string; specId: string; scheme: string | null }[]> {
  return db
    .select({ id: shortlists.id, title: shortlists.title, specId: shortlists.specId, scheme: candidates.scheme })
    .from(shortlists)
    .leftJoin(candidates, eq(candidates.id, shortlists.decidedCandidateId))
    .where(eq(shortlists.status, 'decided'))
    .orderBy(desc(shortlists.decidedAt))
    .limit(500);
}
