import { sql } from 'drizzle-orm';
import {
  bigserial, boolean, check, index, integer, jsonb, pgTable, text, timestamp,
} from 'drizzle-orm/pg-core';

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
    requirements: jsonb('requirements').$type<Record<string, unknown>>().notNull(),
    version: integer('version').notNull().default(1),
    /** The server's own evaluation of `requirements` at `version`, with the engine version it used. */
    comparison: jsonb('comparison').$type<Record<string, unknown>>(),
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
