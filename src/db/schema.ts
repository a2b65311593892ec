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

export const lightEnum = pgEnum('readiness_light', ['green', 'amber', 'red']);

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
  // Carried in the session token; raising it ends every session of this user at once
  // ("sign out everywhere", deactivation). Checked on every request.
  sessionVersion: integer('session_version').notNull().default(0),
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
    // The readiness as last computed (src/lib/readiness), stored so the queue can filter and sort on it.
    readinessLight: lightEnum('readiness_light').notNull().default('amber'),
    readinessRank: integer('readiness_rank').notNull().default(1),
    readinessGaps: integer('readiness_gaps').notNull().default(0),
    readinessChecks: jsonb('readiness_checks').notNull().default([]),
    readinessAt: timestamp('readiness_at', { withTimezone: true }),
    // What the office or surveyor recorded that no customer answer can supply (SiteMeasures in
    // src/lib/readiness/types.ts): measured maximum demand, the 722.411.4.1 measure, RA and IΔn.
    siteMeasures: jsonb('site_measures').notNull().default({}),
    remindersSent: integer('reminders_sent').notNull().default(0),
    // Lower-cased (so LIKE, cheaper than ILIKE, will do) customer name, e-mail, postcode without spaces, reference and MPAN: one
    // trigram-indexed column, so the office's search is one indexed ILIKE, not an OR over a join.
    searchText: text('search_text').notNull().default(''),
    lastChasedAt: timestamp('last_chased_at', { withTimezone: true }),
    // Set when the customer changes answers or uploads after the office marked the case ready
    // (or overrode red checks); cleared when the office looks again and re-marks it.
    changedSinceReadyAt: timestamp('changed_since_ready_at', { withTimezone: true }),
    // What changed since then: [{ at, what, detail }], newest last.
    changesSinceReady: jsonb('changes_since_ready').notNull().default([]),
    // Checklist answers the installer filled in from the invitation ("about.fullName", …) that the
    // customer has not yet confirmed or changed: the customer's progress counts them "to check".
    prefilled: jsonb('prefilled').$type<string[]>().notNull().default([]),
    // When the customer confirmed the details from the invitation.
    detailsConfirmedAt: timestamp('details_confirmed_at', { withTimezone: true }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('cases_customer_idx').on(t.customerId),
    index('cases_stage_idx').on(t.stage),
    index('cases_surveyor_idx').on(t.surveyorId),
    index('cases_light_idx').on(t.readinessRank, t.invitedAt),
    index('cases_invited_idx').on(t.invitedAt),
    index('cases_postcode_idx').on(t.postcode),
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

export const uploadKindEnum = pgEnum('upload_kind', [
  'meter_photo',
  'cutout_photo',
  'consumer_unit_photo',
  'charger_location_photo',
  'parking_evidence',
  'order_agreement',
  'landlord_permission',
  'other',
]);

export const uploadStatusEnum = pgEnum('upload_status', ['waiting', 'accepted', 'rejected']);

/**
 * One photo or document a case's customer (or the office) sent. The bytes live in storage
 * under `storage_key` (a random id, never the user's name); images are re-encoded first.
 */
export const uploads = pgTable(
  'uploads',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    caseId: uuid('case_id')
      .notNull()
      .references(() => cases.id, { onDelete: 'cascade' }),
    kind: uploadKindEnum('kind').notNull(),
    mimeType: text('mime_type').notNull(),
    sizeBytes: integer('size_bytes').notNull(),
    /** Hex SHA-256 of the stored bytes (after re-encoding), not of what was sent. */
    sha256: text('sha256').notNull(),
    width: integer('width'),
    height: integer('height'),
    /** The sender's file name, sanitised; metadata only, never a path. */
    originalName: text('original_name'),
    uploadedBy: text('uploaded_by').references(() => users.id, { onDelete: 'set null' }),
    status: uploadStatusEnum('status').notNull().default('waiting'),
    reason: text('reason'),
    reviewedBy: text('reviewed_by').references(() => users.id, { onDelete: 'set null' }),
    reviewedAt: timestamp('reviewed_at', { withTimezone: true }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    storageKey: text('storage_key').notNull().unique(),
    thumbKey: text('thumb_key'),
    /** The photo check at upload: false when it found a problem, null for documents (and older rows). */
    qualityOk: boolean('quality_ok'),
    /** The check's answer `{ ok, problems, measures }` (src/lib/photo-quality.ts). */
    quality: jsonb('quality'),
    /** 64-bit difference hash of the photo as 16 hex digits, compared with the case's other photos. */
    perceptualHash: text('perceptual_hash'),
  },
  (t) => [index('uploads_case_idx').on(t.caseId, t.createdAt)],
);

export type User = typeof users.$inferSelect;
export type Role = (typeof roleEnum.enumValues)[number];
export type Stage = (typeof stageEnum.enumValues)[number];
export type CaseRow = typeof cases.$inferSelect;
export type UploadRow = typeof uploads.$inferSelect;

/** Office notes on a case, newest last. */
export const caseNotes = pgTable(
  'case_notes',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    caseId: uuid('case_id')
      .notNull()
      .references(() => cases.id, { onDelete: 'cascade' }),
    authorId: text('author_id').references(() => users.id, { onDelete: 'set null' }),
    body: text('body').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('case_notes_case_idx').on(t.caseId, t.createdAt)],
);

/** Every e-mail Groundwork sends about a case: the history on the case page. */
export const emailLog = pgTable(
  'email_log',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    caseId: uuid('case_id').references(() => cases.id, { onDelete: 'cascade' }),
    kind: text('kind').notNull(),
    toEmail: text('to_email').notNull(),
    subject: text('subject').notNull(),
    text: text('text').notNull(),
    sentById: text('sent_by_id').references(() => users.id, { onDelete: 'set null' }),
    messageId: text('message_id'),
    // For scheduled reminders: the slot key makes a retried job unable to send twice.
    dedupeKey: text('dedupe_key').unique(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('email_log_case_idx').on(t.caseId, t.createdAt)],
);

export type Light = (typeof lightEnum.enumValues)[number];

export const surveyOutcomeEnum = pgEnum('survey_outcome', ['go_ahead', 'go_ahead_with_changes', 'cannot_install']);

/** What the surveyor found on site: one record per case, its confirmed values feed the checks. */
export const surveyOutcomes = pgTable('survey_outcomes', {
  caseId: uuid('case_id')
    .primaryKey()
    .references(() => cases.id, { onDelete: 'cascade' }),
  outcome: surveyOutcomeEnum('outcome').notNull(),
  confirmedEarthing: text('confirmed_earthing'),
  confirmedFuseAmps: integer('confirmed_fuse_amps'),
  // The BS 7671 722.411.4.1 measure chosen for PME earthing, as in earthingMeasureValues.
  earthingMeasure: text('earthing_measure'),
  // Measured or noted values, e.g. { zeOhms: 0.21, cableRunMetres: 14, pfcKa: 1.6 }.
  measurements: jsonb('measurements').notNull().default({}),
  notes: text('notes'),
  surveyorId: text('surveyor_id').references(() => users.id, { onDelete: 'set null' }),
  recordedAt: timestamp('recorded_at', { withTimezone: true }).notNull().defaultNow(),
});

/**
 * Fixed-window counters for rate limits, shared by every app process and kept across restarts.
 * One row per limit and key (e.g. "password-email:ann@example.com"); old windows are pruned.
 */
export const rateLimits = pgTable(
  'rate_limits',
  {
    key: text('key').primaryKey(),
    windowStart: timestamp('window_start', { withTimezone: true }).notNull(),
    count: integer('count').notNull(),
  },
  (t) => [index('rate_limits_window_idx').on(t.windowStart)],
);

/** Sessions ended by signing out: a session id here no longer signs anyone in, until it expires. */
export const revokedSessions = pgTable(
  'revoked_sessions',
  {
    sessionId: text('session_id').primaryKey(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
  },
  (t) => [index('revoked_sessions_expires_idx').on(t.expiresAt)],
);

/**
 * A customer's yes to text messages: the mobile it covers and when they said so. One row per
 * customer; a withdrawal (in the checklist, or a STOP reply) keeps the row with withdrawn_at set,
 * and each change is also in the audit trail.
 */
export const textConsents = pgTable(
  'text_consents',
  {
    userId: text('user_id')
      .primaryKey()
      .references(() => users.id, { onDelete: 'cascade' }),
    // E.164, e.g. +447700900123.
    mobile: text('mobile').notNull(),
    consentedAt: timestamp('consented_at', { withTimezone: true }).notNull(),
    withdrawnAt: timestamp('withdrawn_at', { withTimezone: true }),
    // 'checklist' (the customer unticked it) or 'stop' (they replied STOP).
    withdrawnVia: text('withdrawn_via'),
  },
  (t) => [index('text_consents_mobile_idx').on(t.mobile)],
);

/**
 * Every text message sent about a case, and every reply received: the case's message history.
 * `text` is stored with any sign-in link replaced by a placeholder, never the working link.
 */
export const textLog = pgTable(
  'text_log',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    caseId: uuid('case_id').references(() => cases.id, { onDelete: 'cascade' }),
    userId: text('user_id').references(() => users.id, { onDelete: 'set null' }),
    direction: text('direction').notNull().default('outbound'),
    kind: text('kind').notNull(),
    mobile: text('mobile').notNull(),
    text: text('text').notNull(),
    // The provider's message id, which its delivery receipts quote.
    providerId: text('provider_id'),
    // queued (logged, not yet accepted), submitted, delivered, failed, rejected, expired, received
    status: text('status').notNull().default('queued'),
    statusDetail: text('status_detail'),
    statusAt: timestamp('status_at', { withTimezone: true }),
    sentById: text('sent_by_id').references(() => users.id, { onDelete: 'set null' }),
    // For scheduled reminders: the slot key makes a retried job unable to text twice.
    dedupeKey: text('dedupe_key').unique(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('text_log_case_idx').on(t.caseId, t.createdAt), index('text_log_provider_idx').on(t.providerId)],
);

/** Vehicle look-ups by registration, cached so a plate typed twice is asked about once. */
export const vehicleLookupCache = pgTable('vehicle_lookup_cache', {
  // Without spaces, upper case: the form the enquiry service takes.
  registration: text('registration').primaryKey(),
  found: boolean('found').notNull(),
  make: text('make'),
  colour: text('colour'),
  fuelType: text('fuel_type'),
  yearOfManufacture: integer('year_of_manufacture'),
  fetchedAt: timestamp('fetched_at', { withTimezone: true }).notNull().defaultNow(),
});

/** What the last look-up on a case found, so the office can tell a looked-up make from a typed one. */
export const caseVehicleLookups = pgTable('case_vehicle_lookups', {
  caseId: uuid('case_id')
    .primaryKey()
    .references(() => cases.id, { onDelete: 'cascade' }),
  registration: text('registration').notNull(),
  make: text('make'),
  colour: text('colour'),
  fuelType: text('fuel_type'),
  yearOfManufacture: integer('year_of_manufacture'),
  lookedUpAt: timestamp('looked_up_at', { withTimezone: true }).notNull().defaultNow(),
});

/** Per-customer look-up counts in fixed windows: the limit holds across app processes. */
export const lookupCounters = pgTable(
  'lookup_counters',
  {
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    windowStart: timestamp('window_start', { withTimezone: true }).notNull(),
    count: integer('count').notNull().default(0),
  },
  (t) => [primaryKey({ columns: [t.userId, t.windowStart] })],
);
