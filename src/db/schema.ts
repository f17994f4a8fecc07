import { sql } from 'drizzle-orm';
import {
  bigserial, boolean, check, customType, index, integer, jsonb, pgTable, primaryKey, text, timestamp, uniqueIndex,
} from 'drizzle-orm/pg-core';
import type { Comparison, SchemeResult } from '../engine/result-types';
import type { StoredLibrary } from '../engine/parts/types';
import type { NormalisedSpec, SchemeOverride, SpecInput } from '../schemas/spec';
import type { SchemeId } from '../engine/scheme-ids';
import type { BriefDraft } from '../schemas/briefs';
import type { BriefContent } from '../schemas/brief-content';

/** PostgreSQL bytea as a Buffer (PGlite returns a Uint8Array, node-postgres a Buffer). */
const bytea = customType<{ data: Buffer; driverData: Uint8Array }>({
  dataType: () => 'bytea',
  fromDriver: (value) => Buffer.from(value),
});

const stamps = {
  createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  updatedAt: timestamp('updated_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
};

export const users = pgTable(
  'users',
  {
    id: text('id').primaryKey(),
    email: text('email').notNull().unique(),
    displayName: text('display_name').notNull(),
    role: text('role', { enum: ['admin', 'architect', 'engineer', 'sales'] }).notNull(),
    passwordHash: text('password_hash').notNull(),
    active: boolean('active').notNull().default(true),
    ...stamps,
  },
  (t) => [check('users_role_check', sql`${t.role} in ('admin', 'architect', 'engineer', 'sales')`)],
);
export type User = typeof users.$inferSelect;
export type NewUser = typeof users.$inferInsert;

/** Lucia sessions: `id` is the SHA-256 of the cookie token, never the token itself. */
export const sessions = pgTable(
  'sessions',
  {
    id: text('id').primaryKey(),
    userId: text('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
    expiresAt: timestamp('expires_at', { withTimezone: true, mode: 'date' }).notNull(),
  },
  (t) => [index('sessions_user_idx').on(t.userId)],
);
export type Session = typeof sessions.$inferSelect;

/** Requirement sets ("specs"); `requirements` holds the evaluate-contract fields in SI units. */
export const specs = pgTable(
  'specs',
  {
    id: text('id').primaryKey(),
    name: text('name').notNull(),
    customer: text('customer').notNull().default(''),
    ownerId: text('owner_id').notNull().references(() => users.id),
    requirements: jsonb('requirements').$type<SpecInput>().notNull(),
    version: integer('version').notNull().default(1),
    /** The server's own evaluation of `requirements` at `version`, with the engine version it used. */
    comparison: jsonb('comparison').$type<Comparison>(),
    engineVersion: text('engine_version'),
    evaluatedAt: timestamp('evaluated_at', { withTimezone: true, mode: 'date' }),
    updatedById: text('updated_by_id').references(() => users.id),
    /** Archived sets leave the lists but stay readable by link and in the audit trail. */
    archivedAt: timestamp('archived_at', { withTimezone: true, mode: 'date' }),
    ...stamps,
  },
  (t) => [index('specs_owner_idx').on(t.ownerId), index('specs_updated_idx').on(t.updatedAt)],
);
export type Spec = typeof specs.$inferSelect;
export type NewSpec = typeof specs.$inferInsert;

export const auditLog = pgTable(
  'audit_log',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    actorId: text('actor_id').references(() => users.id),
    action: text('action').notNull(),
    entityType: text('entity_type').notNull(),
    entityId: text('entity_id'),
    details: jsonb('details').$type<Record<string, unknown>>().notNull().default({}),
    at: timestamp('at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [index('audit_entity_idx').on(t.entityType, t.entityId), index('audit_at_idx').on(t.at)],
);
export type AuditEntry = typeof auditLog.$inferSelect;

/**
 * Failed sign-ins of the last 15 minutes, one row each: the throttle counts these, so its limits hold across
 * every server process on one database (src/lib/server/throttle.ts). `address` is the client's address key
 * (an IPv6 client by its /64), `accountKey` the normalised e-mail, known account or not.
 */
export const signInFailures = pgTable(
  'sign_in_failures',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    accountKey: text('account_key').notNull(),
    address: text('address').notNull(),
    failedAt: timestamp('failed_at', { withTimezone: true, mode: 'date' }).notNull(),
  },
  (t) => [
    index('sign_in_failures_account_idx').on(t.accountKey, t.failedAt),
    index('sign_in_failures_address_idx').on(t.address, t.failedAt),
    index('sign_in_failures_at_idx').on(t.failedAt),
  ],
);

// ── Shortlists and ballots ────────────────────────────────────────────────────────────────

export const SHORTLIST_STATUSES = ['draft', 'voting', 'closed', 'decided', 'withdrawn'] as const;
export type ShortlistStatus = (typeof SHORTLIST_STATUSES)[number];

export const shortlists = pgTable(
  'shortlists',
  {
    id: text('id').primaryKey(),
    specId: text('spec_id').notNull().references(() => specs.id),
    title: text('title').notNull(),
    ownerId: text('owner_id').notNull().references(() => users.id),
    status: text('status', { enum: SHORTLIST_STATUSES }).notNull().default('draft'),
    deadline: timestamp('deadline', { withTimezone: true, mode: 'date' }),
    openedAt: timestamp('opened_at', { withTimezone: true, mode: 'date' }),
    closedAt: timestamp('closed_at', { withTimezone: true, mode: 'date' }),
    /** Set when the day-before-deadline reminder went out, so it goes once. */
    reminderSentAt: timestamp('reminder_sent_at', { withTimezone: true, mode: 'date' }),
    decidedCandidateId: text('decided_candidate_id'),
    rationale: text('rationale'),
    decidedById: text('decided_by_id').references(() => users.id),
    decidedAt: timestamp('decided_at', { withTimezone: true, mode: 'date' }),
    ...stamps,
  },
  (t) => [
    index('shortlists_spec_idx').on(t.specId),
    check('shortlists_status_check', sql`${t.status} in ('draft', 'voting', 'closed', 'decided', 'withdrawn')`),
  ],
);
export type Shortlist = typeof shortlists.$inferSelect;

/** Who is invited to vote on a shortlist. */
export const shortlistVoters = pgTable(
  'shortlist_voters',
  {
    shortlistId: text('shortlist_id').notNull().references(() => shortlists.id, { onDelete: 'cascade' }),
    userId: text('user_id').notNull().references(() => users.id),
  },
  (t) => [primaryKey({ columns: [t.shortlistId, t.userId] })],
);

/** A candidate: one scheme with its options, frozen as snapshots (re-evaluation adds one). */
export const candidates = pgTable(
  'candidates',
  {
    id: text('id').primaryKey(),
    shortlistId: text('shortlist_id').notNull().references(() => shortlists.id, { onDelete: 'cascade' }),
    scheme: text('scheme').$type<SchemeId>().notNull(),
    overrides: jsonb('overrides').$type<SchemeOverride>().notNull().default({}),
    note: text('note').notNull().default(''),
    createdById: text('created_by_id').notNull().references(() => users.id),
    createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
    /** Removed while in draft; kept for the history. */
    removedAt: timestamp('removed_at', { withTimezone: true, mode: 'date' }),
  },
  (t) => [index('candidates_shortlist_idx').on(t.shortlistId)],
);
export type Candidate = typeof candidates.$inferSelect;

export const candidateSnapshots = pgTable(
  'candidate_snapshots',
  {
    id: text('id').primaryKey(),
    candidateId: text('candidate_id').notNull().references(() => candidates.id, { onDelete: 'cascade' }),
    /** The engine's full result for the scheme. */
    result: jsonb('result').$type<SchemeResult>().notNull(),
    /** The normalised requirement set the result was computed from. */
    input: jsonb('input').$type<NormalisedSpec>().notNull(),
    engineVersion: text('engine_version').notNull(),
    specVersion: integer('spec_version').notNull(),
    partsLibraryVersion: text('parts_library_version'),
    createdById: text('created_by_id').notNull().references(() => users.id),
    createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [index('candidate_snapshots_candidate_idx').on(t.candidateId, t.createdAt)],
);
export type CandidateSnapshot = typeof candidateSnapshots.$inferSelect;

/** One ballot per voter per shortlist (the unique index enforces it). */
export const ballots = pgTable(
  'ballots',
  {
    id: text('id').primaryKey(),
    shortlistId: text('shortlist_id').notNull().references(() => shortlists.id, { onDelete: 'cascade' }),
    voterId: text('voter_id').notNull().references(() => users.id),
    ranking: jsonb('ranking').$type<string[]>().notNull(),
    concerns: jsonb('concerns').$type<{ candidateId: string; reason: string }[]>().notNull().default([]),
    comment: text('comment').notNull().default(''),
    ...stamps,
  },
  (t) => [uniqueIndex('ballots_one_per_voter').on(t.shortlistId, t.voterId)],
);
export type Ballot = typeof ballots.$inferSelect;

// ── Mail ──────────────────────────────────────────────────────────────────────────────────

/** Every message the app sends; in demo/development mode captured by the local SMTP server. */
export const outbox = pgTable(
  'outbox',
  {
    id: text('id').primaryKey(),
    kind: text('kind').notNull(),
    toAddresses: text('to_addresses').notNull(),
    ccAddresses: text('cc_addresses').notNull().default(''),
    subject: text('subject').notNull(),
    textBody: text('text_body').notNull(),
    htmlBody: text('html_body').notNull(),
    relatedType: text('related_type'),
    relatedId: text('related_id'),
    /** `captured` by the local fake server, `sent` to a real one, or `failed`. */
    status: text('status').notNull(),
    error: text('error'),
    messageId: text('message_id'),
    /** The raw message as the SMTP server received it (captured mode). */
    raw: text('raw'),
    createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [index('outbox_related_idx').on(t.relatedType, t.relatedId), index('outbox_created_idx').on(t.createdAt)],
);
export type OutboxMessage = typeof outbox.$inferSelect;

// ── Parts library ─────────────────────────────────────────────────────────────────────────

/**
 * The parts library as immutable versions: each change stores the whole library (a few
 * hundred parts) with a summary, so any version can be exported and results name theirs.
 */
export const partsLibraryVersions = pgTable('parts_library_versions', {
  version: integer('version').primaryKey(),
  library: jsonb('library').$type<StoredLibrary>().notNull(),
  summary: text('summary').notNull(),
  /** Per-part changes: [{op: 'add'|'change'|'retire', category, id, fields?}]. */
  changes: jsonb('changes').$type<Record<string, unknown>[]>().notNull().default([]),
  actorId: text('actor_id').references(() => users.id),
  createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
});
export type PartsLibraryVersion = typeof partsLibraryVersions.$inferSelect;

// ── Uploads ───────────────────────────────────────────────────────────────────────────────

/**
 * Uploaded files (customer specs, parts CSV; at most 2 MB of text), served only through a role check. The
 * content is kept in the row, so every server process on a shared PostgreSQL database can serve it; rows
 * from before that (content null) name a file under DATA_DIR/uploads by `storedName`.
 */
export const uploads = pgTable(
  'uploads',
  {
    id: text('id').primaryKey(),
    filename: text('filename').notNull(),
    sizeBytes: integer('size_bytes').notNull(),
    mimeType: text('mime_type').notNull(),
    sha256: text('sha256').notNull(),
    storedName: text('stored_name').notNull().unique(),
    content: bytea('content'),
    uploaderId: text('uploader_id').notNull().references(() => users.id),
    relatedType: text('related_type'),
    relatedId: text('related_id'),
    createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [index('uploads_related_idx').on(t.relatedType, t.relatedId)],
);
export type Upload = typeof uploads.$inferSelect;

// ── Feasibility briefs ────────────────────────────────────────────────────────────────────

export const briefs = pgTable(
  'briefs',
  {
    id: text('id').primaryKey(),
    specId: text('spec_id').notNull().references(() => specs.id),
    shortlistId: text('shortlist_id').references(() => shortlists.id),
    title: text('title').notNull(),
    customerName: text('customer_name').notNull(),
    customerContact: text('customer_contact').notNull().default(''),
    /** Editable draft: summary text, recommended scheme, contingency, risks… */
    draft: jsonb('draft').$type<BriefDraft>().notNull(),
    createdById: text('created_by_id').notNull().references(() => users.id),
    ...stamps,
  },
  (t) => [index('briefs_spec_idx').on(t.specId)],
);
export type Brief = typeof briefs.$inferSelect;

/** Each send freezes the brief as it went out. */
export const briefVersions = pgTable(
  'brief_versions',
  {
    id: text('id').primaryKey(),
    briefId: text('brief_id').notNull().references(() => briefs.id, { onDelete: 'cascade' }),
    version: integer('version').notNull(),
    content: jsonb('content').$type<BriefContent>().notNull(),
    sentTo: text('sent_to').notNull().default(''),
    sentById: text('sent_by_id').references(() => users.id),
    sentAt: timestamp('sent_at', { withTimezone: true, mode: 'date' }),
    createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('brief_versions_unique').on(t.briefId, t.version)],
);
export type BriefVersion = typeof briefVersions.$inferSelect;

/** Read-only share links: only the SHA-256 of the token is stored. */
export const briefShares = pgTable(
  'brief_shares',
  {
    id: text('id').primaryKey(),
    briefVersionId: text('brief_version_id').notNull().references(() => briefVersions.id, { onDelete: 'cascade' }),
    tokenHash: text('token_hash').notNull().unique(),
    createdById: text('created_by_id').notNull().references(() => users.id),
    createdAt: timestamp('created_at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
    expiresAt: timestamp('expires_at', { withTimezone: true, mode: 'date' }).notNull(),
    revokedAt: timestamp('revoked_at', { withTimezone: true, mode: 'date' }),
  },
  (t) => [index('brief_shares_version_idx').on(t.briefVersionId)],
);
export type BriefShare = typeof briefShares.$inferSelect;

export const briefShareViews = pgTable(
  'brief_share_views',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    shareId: text('share_id').notNull().references(() => briefShares.id, { onDelete: 'cascade' }),
    at: timestamp('at', { withTimezone: true, mode: 'date' }).notNull().defaultNow(),
    address: text('address').notNull().default(''),
    userAgent: text('user_agent').notNull().default(''),
  },
  (t) => [index('brief_share_views_share_idx').on(t.shareId)],
);
