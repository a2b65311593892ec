/**
 * Groundwork's database schema (Drizzle, PostgreSQL). Server-only.
 * Migrations are generated from this file by drizzle-kit into drizzle/; never edit an
 * applied migration — change this file and generate a new one.
 */
import {
  bigserial,
  boolean,
  date,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uuid,
} from 'drizzle-orm/pg-core';
import type { AdapterAccountType } from '@auth/core/adapters';

export const roleEnum = pgEnum('role', ['customer', 'admin', 'surveyor']);

export const stageEnum = pgEnum('case_stage', [
  'invited',
  'filling_in',
  'sent_for_review',
  'in_review',
  'ready_for_survey',
  'survey_booked',
  'surveyed',
  'withdrawn',
]);

// The users table doubles as Auth.js's users table (id, name, email, emailVerified, image).
export const users = pgTable('users', {
  id: text('id')
    .primaryKey()
    .$defaultFn(() => crypto.randomUUID()),
  name: text('name'),
  email: text('email').notNull().unique(),
  emailVerified: timestamp('email_verified', { mode: 'date', withTimezone: true }),
  image: text('image'),
  role: roleEnum('role').notNull().default('customer'),
  passwordHash: text('password_hash'),
  phone: text('phone'),
  active: boolean('active').notNull().default(true),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});

export const accounts = pgTable(
  'accounts',
  {
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    type: text('type').$type<AdapterAccountType>().notNull(),
    provider: text('provider').notNull(),
    providerAccountId: text('provider_account_id').notNull(),
    refresh_token: text('refresh_token'),
    access_token: text('access_token'),
    expires_at: integer('expires_at'),
    token_type: text('token_type'),
    scope: text('scope'),
    id_token: text('id_token'),
    session_state: text('session_state'),
  },
  (t) => [primaryKey({ columns: [t.provider, t.providerAccountId] })],
);

export const sessions = pgTable('sessions', {
  sessionToken: text('session_token').primaryKey(),
  userId: text('user_id')
    .notNull()
    .references(() => users.id, { onDelete: 'cascade' }),
  expires: timestamp('expires', { mode: 'date', withTimezone: true }).notNull(),
});

export const verificationTokens = pgTable(
  'verification_tokens',
  {
    identifier: text('identifier').notNull(),
    token: text('token').notNull(),
    expires: timestamp('expires', { mode: 'date', withTimezone: true }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.identifier, t.token] })],
);

/** Key/value settings: readiness thresholds, lead times, firm details. */
export const settings = pgTable('settings', {
  key: text('key').primaryKey(),
  value: jsonb('value').notNull(),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  updatedBy: text('updated_by').references(() => users.id, { onDelete: 'set null' }),
});

export const cases = pgTable(
  'cases',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    reference: text('reference').notNull().unique(),
    customerId: text('customer_id')
      .notNull()
      .references(() => users.id, { onDelete: 'restrict' }),
    addressLine1: text('address_line1'),
    addressLine2: text('address_line2'),
    town: text('town'),
    postcode: text('postcode'),
    stage: stageEnum('stage').notNull().default('invited'),
    checklist: jsonb('checklist').notNull().default({}),
    version: integer('version').notNull().default(1),
    surveyorId: text('surveyor_id').references(() => users.id, { onDelete: 'set null' }),
    surveyDate: date('survey_date'),
    invitedAt: timestamp('invited_at', { withTimezone: true }).notNull().defaultNow(),
    submittedAt: timestamp('submitted_at', { withTimezone: true }),
    lastCustomerActivityAt: timestamp('last_customer_activity_at', { withTimezone: true }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('cases_customer_idx').on(t.customerId),
    index('cases_stage_idx').on(t.stage),
    index('cases_surveyor_idx').on(t.surveyorId),
  ],
);

/** Who changed what, when: every write to a case or account lands here. */
export const auditLog = pgTable(
  'audit_log',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    caseId: uuid('case_id').references(() => cases.id, { onDelete: 'cascade' }),
    actorId: text('actor_id').references(() => users.id, { onDelete: 'set null' }),
    action: text('action').notNull(),
    entity: text('entity').notNull(),
    entityId: text('entity_id'),
    before: jsonb('before'),
    after: jsonb('after'),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('audit_case_idx').on(t.caseId, t.at)],
);

export type User = typeof users.$inferSelect;
export type Role = (typeof roleEnum.enumValues)[number];
export type Stage = (typeof stageEnum.enumValues)[number];
export type CaseRow = typeof cases.$inferSelect;
