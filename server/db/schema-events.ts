import { sql } from 'drizzle-orm'
import { check, index, integer, primaryKey, sqliteTable, text } from 'drizzle-orm/sqlite-core'
import type { EventCharger, EventPoolEntry, EventSummary } from '../../shared/schemas/events'
import { users } from './schema'
import { ownedItemColumns, plans } from './schema-resources'

// Events: one day of several saved plans sharing a pool of packs and the venue's chargers.
// A plan in an event is ON DELETE RESTRICT: the API refuses to delete it and names the event.

export const events = sqliteTable(
  'events',
  {
    ...ownedItemColumns(),
    /** The event's local calendar date, YYYY-MM-DD. */
    date: text('date').notNull(),
    pool: text('pool', { mode: 'json' }).$type<EventPoolEntry[]>().notNull(),
    chargers: text('chargers', { mode: 'json' }).$type<EventCharger[]>().notNull(),
    /**
     * What the list shows, worked out at every save of the event, of one of its plans or of their
     * rigs, and again at start when the engine's version changed; null only until then.
     */
    summary: text('summary', { mode: 'json' }).$type<EventSummary>(),
    summaryEngineVersion: text('summary_engine_version'),
  },
  (table) => [
    index('events_team_name_idx').on(table.teamId, table.name),
    check(
      'events_date_check',
      sql`${table.date} glob '[0-9][0-9][0-9][0-9]-[0-9][0-9]-[0-9][0-9]'`,
    ),
  ],
)

/** The plans of an event, in the order the crew listed them. */
export const eventPlans = sqliteTable(
  'event_plans',
  {
    eventId: integer('event_id')
      .notNull()
      .references(() => events.id, { onDelete: 'cascade' }),
    planId: integer('plan_id')
      .notNull()
      .references(() => plans.id, { onDelete: 'restrict' }),
    position: integer('position').notNull(),
  },
  (table) => [
    primaryKey({ columns: [table.eventId, table.planId] }),
    index('event_plans_plan_id_idx').on(table.planId),
  ],
)

/** Read-only links to an event's card; only the SHA-256 of the token is kept. */
export const eventShareLinks = sqliteTable(
  'event_share_links',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    eventId: integer('event_id')
      .notNull()
      .references(() => events.id, { onDelete: 'cascade' }),
    tokenHash: text('token_hash').notNull().unique(),
    label: text('label').notNull().default(''),
    createdByUserId: integer('created_by_user_id').references(() => users.id, {
      onDelete: 'set null',
    }),
    createdAtMs: integer('created_at_ms').notNull(),
    expiresAtMs: integer('expires_at_ms'),
    revokedAtMs: integer('revoked_at_ms'),
  },
  (table) => [index('event_share_links_event_id_idx').on(table.eventId)],
)
