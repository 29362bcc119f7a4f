// The Drizzle schema is the source of truth; `npm run db:generate` writes the
// SQL migrations in drizzle/. Property names are camelCase, columns snake_case
// (the `casing` option in drizzle.config.ts and server/db/client.ts).
import { sql } from 'drizzle-orm';
import { blob, index, integer, real, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core';
import {
  type Applicability,
  type CostItem,
  type Effect,
  MODIFIERS,
  PRICE_ENTITIES,
  PRICE_FIELDS,
  type PriceValue,
  TREATMENT_CATEGORIES,
  TREATMENT_KINDS,
} from '../../shared/schemas/catalog';
import { ROLES } from '../../shared/schemas/common';
import { FUNCTIONAL_CLASSES, SURFACES } from '../../shared/schemas/segments';
import { RUN_KINDS, RUN_STATUSES, type RunError } from '../../shared/schemas/runs';

const createdAt = () => text().notNull().default(sql`(strftime('%Y-%m-%dT%H:%M:%fZ','now'))`);
/** The owning agency: every agency's row goes when the agency does. */
const agencyRef = () =>
  text()
    .notNull()
    .references(() => agencies.id, { onDelete: 'cascade' });

export const agencies = sqliteTable('agencies', {
  id: text().primaryKey(),
  name: text().notNull(),
  kind: text({ enum: ['county', 'city', 'other'] }).notNull(),
  state: text(),
  units: text({ enum: ['us', 'metric'] })
    .notNull()
    .default('us'),
  discountRate: real().notNull().default(0.02),
  discountRateSource: text(),
  analysisPeriodYears: integer().notNull().default(40),
  baseYear: integer().notNull(),
  mobilizationPerJob: real().notNull().default(0),
  trafficControlPerDay: real().notNull().default(0),
  engineeringFraction: real().notNull().default(0),
  contingencyFraction: real().notNull().default(0),
  createdAt: createdAt(),
});

export const users = sqliteTable('users', {
  id: text().primaryKey(),
  email: text().notNull().unique(),
  name: text().notNull(),
  passwordHash: text().notNull(),
  // Bumped when the password changes, so older sessions stop being accepted.
  sessionVersion: integer().notNull().default(1),
  isDemo: integer({ mode: 'boolean' }).notNull().default(false),
  createdAt: createdAt(),
});

export const memberships = sqliteTable(
  'memberships',
  {
    id: integer().primaryKey({ autoIncrement: true }),
    agencyId: agencyRef(),
    userId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    role: text({ enum: ROLES }).notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('memberships_agency_user').on(t.agencyId, t.userId)],
);

export const invitations = sqliteTable(
  'invitations',
  {
    id: text().primaryKey(),
    agencyId: agencyRef(),
    email: text().notNull(),
    role: text({ enum: ROLES }).notNull(),
    tokenHash: text().notNull().unique(),
    invitedBy: text().references(() => users.id, { onDelete: 'set null' }),
    expiresAt: text().notNull(),
    acceptedAt: text(),
    revokedAt: text(),
    createdAt: createdAt(),
  },
  (t) => [index('invitations_agency').on(t.agencyId)],
);

export const passwordResets = sqliteTable('password_resets', {
  id: text().primaryKey(),
  userId: text()
    .notNull()
    .references(() => users.id, { onDelete: 'cascade' }),
  tokenHash: text().notNull().unique(),
  expiresAt: text().notNull(),
  usedAt: text(),
  createdAt: createdAt(),
});

// Messages received by the local mail catcher. agencyId tags mail that belongs
// to one agency (invitations, plan notices) so admins only see their own.
export const caughtMail = sqliteTable(
  'caught_mail',
  {
    id: integer().primaryKey({ autoIncrement: true }),
    agencyId: text(),
    fromAddress: text().notNull(),
    toAddress: text().notNull(),
    subject: text().notNull(),
    textBody: text().notNull(),
    htmlBody: text(),
    receivedAt: createdAt(),
  },
  (t) => [index('caught_mail_agency').on(t.agencyId)],
);

export const segments = sqliteTable(
  'segments',
  {
    id: integer().primaryKey({ autoIncrement: true }),
    agencyId: agencyRef(),
    segmentId: text().notNull(),
    roadName: text().notNull(),
    fromDesc: text(),
    toDesc: text(),
    lengthMi: real().notNull(),
    widthFt: real().notNull(),
    lanes: integer().notNull(),
    functionalClass: text({ enum: FUNCTIONAL_CLASSES }).notNull(),
    surface: text({ enum: SURFACES }).notNull(),
    adt: integer(),
    truckPct: real(),
    district: text(),
    lastTreatment: text(),
    lastTreatmentYear: integer(),
    pci: real(),
    pciDate: text(),
    geometry: text(), // GeoJSON LineString / MultiLineString in WGS84, as text
    notes: text(),
    updatedAt: createdAt(),
  },
  (t) => [
    uniqueIndex('segments_agency_segment').on(t.agencyId, t.segmentId),
    index('segments_agency_road').on(t.agencyId, t.roadName),
  ],
);

export const surveys = sqliteTable(
  'surveys',
  {
    id: integer().primaryKey({ autoIncrement: true }),
    agencyId: agencyRef(),
    segmentRef: integer()
      .notNull()
      .references(() => segments.id, { onDelete: 'cascade' }),
    surveyDate: text().notNull(),
    pci: real().notNull(),
    source: text(),
  },
  (t) => [
    index('surveys_segment').on(t.segmentRef),
    uniqueIndex('surveys_segment_date').on(t.segmentRef, t.surveyDate),
  ],
);

// Work done on a segment, one row per job: what the segment page lists as its
// treatment history. The segment's last_treatment columns follow the newest row.
export const treatmentRecords = sqliteTable(
  'treatment_records',
  {
    id: integer().primaryKey({ autoIncrement: true }),
    agencyId: agencyRef(),
    segmentRef: integer()
      .notNull()
      .references(() => segments.id, { onDelete: 'cascade' }),
    treatedOn: text().notNull(), // ISO date the work was finished
    kind: text({ enum: TREATMENT_KINDS }).notNull(),
    name: text().notNull(),
    treatmentId: text().references(() => treatments.id, { onDelete: 'set null' }),
    mix: text(),
    thicknessIn: real(),
    costUsd: real(),
    notes: text(),
    userId: text().references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [index('treatment_records_segment').on(t.segmentRef, t.treatedOn)],
);

export const auditLog = sqliteTable(
  'audit_log',
  {
    id: integer().primaryKey({ autoIncrement: true }),
    agencyId: text(),
    userId: text(),
    action: text().notNull(),
    entity: text().notNull(),
    entityId: text(),
    detail: text(), // JSON: before/after of changed fields
    at: createdAt(),
  },
  (t) => [index('audit_agency_at').on(t.agencyId, t.at)],
);

export const imports = sqliteTable(
  'imports',
  {
    id: text().primaryKey(),
    agencyId: agencyRef(),
    userId: text().references(() => users.id, { onDelete: 'set null' }),
    fileName: text().notNull(),
    kind: text({ enum: ['segments', 'surveys'] }).notNull(),
    format: text().notNull(),
    mode: text().notNull(),
    added: integer().notNull(),
    updated: integer().notNull(),
    unchanged: integer().notNull(),
    rejected: integer().notNull(),
    // The rejected rows as CSV with a reason column, for download.
    rejectedCsv: text(),
    createdAt: createdAt(),
  },
  (t) => [index('imports_agency').on(t.agencyId, t.createdAt)],
);

export const importMappings = sqliteTable(
  'import_mappings',
  {
    agencyId: agencyRef(),
    kind: text().notNull(),
    mapping: text().notNull(),
    updatedAt: createdAt(),
  },
  (t) => [uniqueIndex('import_mappings_agency_kind').on(t.agencyId, t.kind)],
);

export const mixes = sqliteTable(
  'mixes',
  {
    id: text().primaryKey(),
    agencyId: agencyRef(),
    name: text().notNull(),
    binderGrade: text().notNull(),
    modifier: text({ enum: MODIFIERS }).notNull(),
    pricePerTon: real().notNull(),
    spreadRateLbPerSyIn: real().notNull(),
    minLiftIn: real().notNull(),
    maxLiftIn: real().notNull(),
    refLiftIn: real().notNull(),
    refLifeYears: real().notNull(),
    coldWeatherNote: text(),
    priceEffectiveDate: text().notNull(),
    isDemo: integer({ mode: 'boolean' }).notNull().default(false),
    createdAt: createdAt(),
  },
  (t) => [index('mixes_agency').on(t.agencyId)],
);

export const treatments = sqliteTable(
  'treatments',
  {
    id: text().primaryKey(),
    agencyId: agencyRef(),
    name: text().notNull(),
    category: text({ enum: TREATMENT_CATEGORIES }).notNull(),
    kind: text({ enum: TREATMENT_KINDS }).notNull(),
    mixId: text().references(() => mixes.id, { onDelete: 'restrict' }),
    defaultThicknessIn: real(),
    millDepthIn: real().notNull().default(0),
    lifeYears: real(),
    productionSyPerDay: real().notNull(),
    costItems: text({ mode: 'json' }).notNull().$type<CostItem[]>(),
    effect: text({ mode: 'json' }).notNull().$type<Effect>(),
    applicability: text({ mode: 'json' }).notNull().$type<Applicability>(),
    priceEffectiveDate: text().notNull(),
    isDemo: integer({ mode: 'boolean' }).notNull().default(false),
    createdAt: createdAt(),
  },
  (t) => [index('treatments_agency').on(t.agencyId)],
);

// Every price change, with the date it takes effect: a saved analysis keeps a
// snapshot of the prices it used, and this table says when they changed.
export const priceHistory = sqliteTable(
  'price_history',
  {
    id: integer().primaryKey({ autoIncrement: true }),
    agencyId: agencyRef(),
    entity: text({ enum: PRICE_ENTITIES }).notNull(),
    entityId: text().notNull(),
    name: text().notNull(),
    field: text({ enum: PRICE_FIELDS }).notNull(),
    // JSON: the field's value before (null for a new item) and after.
    before: text({ mode: 'json' }).$type<PriceValue>(),
    after: text({ mode: 'json' }).$type<PriceValue>(),
    effectiveDate: text().notNull(),
    userId: text(),
    at: createdAt(),
  },
  (t) => [index('price_history_agency').on(t.agencyId, t.at)],
);

export const analyses = sqliteTable(
  'analyses',
  {
    id: text().primaryKey(),
    agencyId: agencyRef(),
    name: text().notNull(),
    createdBy: text().references(() => users.id, { onDelete: 'set null' }),
    // The full input snapshot (catalog items, prices, economics, quantities): re-runs reproduce exactly.
    input: text().notNull(),
    result: text(),
    createdAt: createdAt(),
    updatedAt: createdAt(),
  },
  (t) => [index('analyses_agency').on(t.agencyId)],
);

export const curveOverrides = sqliteTable(
  'curve_overrides',
  {
    agencyId: agencyRef(),
    familyKey: text().notNull(),
    p0: real().notNull(),
    a: real().notNull(),
    b: real().notNull(),
    updatedAt: createdAt(),
  },
  (t) => [uniqueIndex('curve_overrides_key').on(t.agencyId, t.familyKey)],
);

export const plans = sqliteTable(
  'plans',
  {
    id: text().primaryKey(),
    agencyId: agencyRef(),
    name: text().notNull(),
    status: text({ enum: ['draft', 'published'] })
      .notNull()
      .default('draft'),
    settings: text().notNull(), // JSON PlanSettingsInput
    createdBy: text().references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    updatedAt: createdAt(),
    publishedAt: text(),
    /** The number of the version the editable copy (name, settings) is; a published version is frozen. */
    version: integer().notNull().default(1),
    /** The frozen version viewers see (null: nothing published). */
    publishedVersionId: text(),
  },
  (t) => [index('plans_agency').on(t.agencyId)],
);

/**
 * A frozen version of a plan, written when it is published: its name, settings, the run it pins
 * (whose stored input is the snapshot the result came from) and the council brief as it was.
 * Never changed afterwards; editing a published plan opens the next version number as a draft.
 */
export const planVersions = sqliteTable(
  'plan_versions',
  {
    id: text().primaryKey(),
    planId: text()
      .notNull()
      .references(() => plans.id, { onDelete: 'cascade' }),
    agencyId: text()
      .notNull()
      .references(() => agencies.id, { onDelete: 'cascade' }),
    version: integer().notNull(),
    name: text().notNull(),
    settings: text().notNull(), // JSON PlanSettingsInput, as published
    runId: text().notNull(),
    brief: blob({ mode: 'buffer' }),
    publishedBy: text().references(() => users.id, { onDelete: 'set null' }),
    publishedAt: text().notNull(),
  },
  (t) => [uniqueIndex('plan_versions_number').on(t.planId, t.version), index('plan_versions_agency').on(t.agencyId)],
);

// Replaced by `runs`; kept (not dropped) this round. Its rows are copied into `runs` at start.
export const planRuns = sqliteTable(
  'plan_runs',
  {
    id: text().primaryKey(),
    planId: text()
      .notNull()
      .references(() => plans.id, { onDelete: 'cascade' }),
    agencyId: text().notNull(),
    status: text({ enum: ['running', 'done', 'failed', 'cancelled'] }).notNull(),
    input: text().notNull(),
    result: text(),
    error: text(),
    startedAt: createdAt(),
    endedAt: text(),
  },
  (t) => [index('plan_runs_plan').on(t.planId, t.startedAt)],
);

// Every run (plan, budget search, comparison): who started it, on what, the
// snapshot of its input, and its outcome. Input and result are UTF-8 JSON kept as
// bytes: workers write and parse them, and the request thread only copies result
// bytes into an answer (a 14 MB snapshot as TEXT costs the writing thread ~250 ms).
export const runs = sqliteTable(
  'runs',
  {
    id: text().primaryKey(),
    agencyId: agencyRef(),
    userId: text().references(() => users.id, { onDelete: 'set null' }),
    kind: text({ enum: RUN_KINDS }).notNull(),
    /** The plan (plan, budget-search) or saved comparison the run belongs to. */
    subjectId: text(),
    status: text({ enum: RUN_STATUSES }).notNull(),
    progress: real().notNull().default(0),
    input: blob({ mode: 'buffer' }).notNull(),
    result: blob({ mode: 'buffer' }),
    error: text({ mode: 'json' }).$type<RunError>(),
    createdAt: createdAt(),
    startedAt: text(),
    endedAt: text(),
  },
  (t) => [index('runs_subject').on(t.agencyId, t.kind, t.subjectId, t.createdAt), index('runs_status').on(t.status)],
);
