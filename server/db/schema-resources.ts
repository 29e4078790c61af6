import { sql } from 'drizzle-orm'
import { check, index, integer, primaryKey, real, sqliteTable, text } from 'drizzle-orm/sqlite-core'
import type {
  AccessorySpec,
  AmplifierSpec,
  EstimateRequest,
  PackSpec,
  ScheduleSegment,
  SpeakersSpec,
  SwapPolicy,
} from '../../shared/schemas/estimate'
import type { DischargePoint } from '../../shared/discharge/analyse'
import type { DischargeFigures } from '../../shared/discharge/log'
import type { PlanSummary, RigSummary } from '../../shared/schemas/resources'
import { teams, users } from './schema'

// The team's parts library, saved rigs, event plans, share links and discharge logs.
// Times are integer milliseconds since the Unix epoch (UTC), as in the accounts tables.
// References from a rig to the parts it was built from are ON DELETE RESTRICT: a part in use
// cannot vanish silently; the API refuses (editors) or detaches it explicitly (admins).

/** Columns every team-owned, versioned item has; a function so each table gets its own copies. */
export function ownedItemColumns() {
  return {
    id: integer('id').primaryKey({ autoIncrement: true }),
    teamId: integer('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    notes: text('notes').notNull().default(''),
    createdByUserId: integer('created_by_user_id').references(() => users.id, {
      onDelete: 'set null',
    }),
    updatedByUserId: integer('updated_by_user_id').references(() => users.id, {
      onDelete: 'set null',
    }),
    createdAtMs: integer('created_at_ms').notNull(),
    updatedAtMs: integer('updated_at_ms').notNull(),
    /** Starts at 1, +1 on every update; an update naming an older version is refused (409). */
    version: integer('version').notNull().default(1),
  }
}

export const packs = sqliteTable(
  'packs',
  { ...ownedItemColumns(), spec: text('spec', { mode: 'json' }).$type<PackSpec>().notNull() },
  (table) => [index('packs_team_name_idx').on(table.teamId, table.name)],
)

export const amplifiers = sqliteTable(
  'amplifiers',
  { ...ownedItemColumns(), spec: text('spec', { mode: 'json' }).$type<AmplifierSpec>().notNull() },
  (table) => [index('amplifiers_team_name_idx').on(table.teamId, table.name)],
)

export const speakers = sqliteTable(
  'speakers',
  { ...ownedItemColumns(), spec: text('spec', { mode: 'json' }).$type<SpeakersSpec>().notNull() },
  (table) => [index('speakers_team_name_idx').on(table.teamId, table.name)],
)

export const accessories = sqliteTable(
  'accessories',
  { ...ownedItemColumns(), spec: text('spec', { mode: 'json' }).$type<AccessorySpec>().notNull() },
  (table) => [index('accessories_team_name_idx').on(table.teamId, table.name)],
)

export const rigs = sqliteTable(
  'rigs',
  {
    ...ownedItemColumns(),
    /** An estimate request; the parts are copies, so editing a saved part leaves the rig alone. */
    spec: text('spec', { mode: 'json' }).$type<EstimateRequest>().notNull(),
    specSchemaVersion: integer('spec_schema_version').notNull(),
    /** Null only when the stored spec no longer passes the schema (after an engine change). */
    summary: text('summary', { mode: 'json' }).$type<RigSummary>(),
    summaryEngineVersion: text('summary_engine_version'),
    packId: integer('pack_id').references(() => packs.id, { onDelete: 'restrict' }),
    amplifierId: integer('amplifier_id').references(() => amplifiers.id, {
      onDelete: 'restrict',
    }),
    speakersId: integer('speakers_id').references(() => speakers.id, { onDelete: 'restrict' }),
  },
  (table) => [
    index('rigs_team_name_idx').on(table.teamId, table.name),
    index('rigs_pack_id_idx').on(table.packId),
    index('rigs_amplifier_id_idx').on(table.amplifierId),
    index('rigs_speakers_id_idx').on(table.speakersId),
  ],
)

/** The saved accessories a rig was built from, in the order of the rig's accessory list. */
export const rigAccessories = sqliteTable(
  'rig_accessories',
  {
    rigId: integer('rig_id')
      .notNull()
      .references(() => rigs.id, { onDelete: 'cascade' }),
    accessoryId: integer('accessory_id')
      .notNull()
      .references(() => accessories.id, { onDelete: 'restrict' }),
    position: integer('position').notNull(),
  },
  (table) => [
    primaryKey({ columns: [table.rigId, table.accessoryId] }),
    index('rig_accessories_accessory_id_idx').on(table.accessoryId),
  ],
)

export const plans = sqliteTable(
  'plans',
  {
    ...ownedItemColumns(),
    rigId: integer('rig_id')
      .notNull()
      .references(() => rigs.id, { onDelete: 'restrict' }),
    /** The event's local calendar date, YYYY-MM-DD. */
    date: text('date').notNull(),
    /** The event's local start time, HH:MM (24-hour). */
    startTime: text('start_time').notNull(),
    temperatureC: real('temperature_c'),
    packCount: integer('pack_count'),
    swapPolicy: text('swap_policy', { mode: 'json' }).$type<SwapPolicy>(),
    schedule: text('schedule', { mode: 'json' }).$type<ScheduleSegment[]>().notNull(),
    summary: text('summary', { mode: 'json' }).$type<PlanSummary>(),
    summaryEngineVersion: text('summary_engine_version'),
  },
  (table) => [
    index('plans_team_name_idx').on(table.teamId, table.name),
    index('plans_rig_id_idx').on(table.rigId),
    check('plans_date_check', sql`${table.date} glob '[0-9][0-9][0-9][0-9]-[0-9][0-9]-[0-9][0-9]'`),
    check('plans_start_time_check', sql`${table.startTime} glob '[0-2][0-9]:[0-5][0-9]'`),
  ],
)

/** Read-only links to a plan's card; only the SHA-256 of the token is kept. */
export const shareLinks = sqliteTable(
  'share_links',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    planId: integer('plan_id')
      .notNull()
      .references(() => plans.id, { onDelete: 'cascade' }),
    tokenHash: text('token_hash').notNull().unique(),
    label: text('label').notNull().default(''),
    createdByUserId: integer('created_by_user_id').references(() => users.id, {
      onDelete: 'set null',
    }),
    createdAtMs: integer('created_at_ms').notNull(),
    expiresAtMs: integer('expires_at_ms'),
    revokedAtMs: integer('revoked_at_ms'),
  },
  (table) => [index('share_links_plan_id_idx').on(table.planId)],
)

/** An uploaded discharge measurement of a saved pack and what was read from it. */
export const dischargeLogs = sqliteTable(
  'discharge_logs',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    packId: integer('pack_id')
      .notNull()
      .references(() => packs.id, { onDelete: 'cascade' }),
    teamId: integer('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    fileName: text('file_name').notNull(),
    uploadedByUserId: integer('uploaded_by_user_id').references(() => users.id, {
      onDelete: 'set null',
    }),
    createdAtMs: integer('created_at_ms').notNull(),
    analysis: text('analysis', { mode: 'json' }).$type<DischargeFigures>().notNull(),
    points: text('points', { mode: 'json' }).$type<DischargePoint[]>().notNull(),
    acceptedAtMs: integer('accepted_at_ms'),
  },
  (table) => [
    index('discharge_logs_pack_id_idx').on(table.packId),
    index('discharge_logs_team_id_idx').on(table.teamId),
  ],
)
