import type { BriefRow, VersionWithShares } from '../../db/queries/briefs';
import type { BriefDraft } from '../../schemas/briefs';
import type { BriefContent } from '../../schemas/brief-content';

const iso = (d: Date | null): string | null => (d === null ? null : d.toISOString());

/** A brief in list replies. */
export function toBriefSummaryJson(b: BriefRow) {
  return {
    id: b.id,
    specId: b.specId,
    specName: b.specName,
    shortlistId: b.shortlistId,
    title: b.title,
    customerName: b.customerName,
    customerContact: b.customerContact,
    createdBy: b.createdByName,
    createdAt: b.createdAt.toISOString(),
    updatedAt: b.updatedAt.toISOString(),
    latestVersion: b.latestVersion,
    lastSentAt: iso(b.lastSentAt),
  };
}

export function toVersionJson(v: VersionWithShares) {
  return {
    version: v.version,
    sentTo: v.sentTo,
    sentBy: v.sentByName,
    sentAt: iso(v.sentAt),
    frozenAt: v.createdAt.toISOString(),
    content: v.content,
    shares: v.shares.map((s) => ({
      id: s.id, createdAt: s.createdAt.toISOString(), expiresAt: s.expiresAt.toISOString(), revokedAt: iso(s.revokedAt),
      views: s.views, lastViewAt: iso(s.lastViewAt),
    })),
  };
}
export type BriefVersionJson = ReturnType<typeof toVersionJson>;

/** One brief: its draft, the live preview and every frozen version. */
export function toBriefJson(b: BriefRow, draft: BriefDraft, preview: BriefContent, versions: VersionWithShares[]) {
  return { ...toBriefSummaryJson(b), draft, preview, versions: versions.map(toVersionJson) };
}
export type BriefJson = ReturnType<typeof toBriefJson>;
