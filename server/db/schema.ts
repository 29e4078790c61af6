import { sql } from 'drizzle-orm'
import { check, index, integer, primaryKey, sqliteTable, text } from 'drizzle-orm/sqlite-core'
import { teamRoles } from '../../shared/schemas/teams'

/** Small facts about the installation itself, e.g. which engine version computed the summaries. */
export const appMeta = sqliteTable('app_meta', {
  key: text('key').primaryKey(),
  value: text('value').notNull(),
})

// Accounts, teams and roles. Times are integer milliseconds since the Unix epoch (UTC).

export const users = sqliteTable('users', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  /** Stored trimmed and lower-cased, so one address is one account. */
  email: text('email').notNull().unique(),
  name: text('name').notNull(),
  passwordHash: text('password_hash').notNull(),
  /** When the owner opened a mailed confirmation link (or a reset link); null until then. */
  emailVerifiedAtMs: integer('email_verified_at_ms'),
  createdAtMs: integer('created_at_ms').notNull(),
  updatedAtMs: integer('updated_at_ms').notNull(),
})

/** One row per signed-in browser; deleting the row ends the session whatever its token says. */
export const sessions = sqliteTable(
  'sessions',
  {
    id: text('id').primaryKey(),
    userId: integer('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    createdAtMs: integer('created_at_ms').notNull(),
    lastSeenAtMs: integer('last_seen_at_ms').notNull(),
    expiresAtMs: integer('expires_at_ms').notNull(),
  },
  (table) => [index('sessions_user_id_idx').on(table.userId)],
)

export const teams = sqliteTable('teams', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  name: text('name').notNull(),
  createdAtMs: integer('created_at_ms').notNull(),
  updatedAtMs: integer('updated_at_ms').notNull(),
})

export const memberships = sqliteTable(
  'memberships',
  {
    teamId: integer('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    userId: integer('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    role: text('role', { enum: teamRoles }).notNull(),
    createdAtMs: integer('created_at_ms').notNull(),
  },
  (table) => [
    primaryKey({ columns: [table.teamId, table.userId] }),
    index('memberships_user_id_idx').on(table.userId),
    check('memberships_role_check', sql`${table.role} in ('viewer', 'editor', 'admin')`),
  ],
)

/** Tokens are stored as SHA-256 hashes: a copy of the database cannot be used to join a team. */
export const invitations = sqliteTable(
  'invitations',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    teamId: integer('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    email: text('email').notNull(),
    role: text('role', { enum: teamRoles }).notNull(),
    tokenHash: text('token_hash').notNull().unique(),
    invitedByUserId: integer('invited_by_user_id').references(() => users.id, {
      onDelete: 'set null',
    }),
    createdAtMs: integer('created_at_ms').notNull(),
    expiresAtMs: integer('expires_at_ms').notNull(),
    acceptedAtMs: integer('accepted_at_ms'),
    acceptedByUserId: integer('accepted_by_user_id').references(() => users.id, {
      onDelete: 'set null',
    }),
  },
  (table) => [
    index('invitations_team_id_idx').on(table.teamId),
    check('invitations_role_check', sql`${table.role} in ('viewer', 'editor', 'admin')`),
  ],
)

/** The columns of a mailed single-use link (reset, address confirmation): the token's hash only. */
const mailedLinkColumns = () => ({
  id: integer('id').primaryKey({ autoIncrement: true }),
  userId: integer('user_id')
    .notNull()
    .references(() => users.id, { onDelete: 'cascade' }),
  tokenHash: text('token_hash').notNull().unique(),
  createdAtMs: integer('created_at_ms').notNull(),
  expiresAtMs: integer('expires_at_ms').notNull(),
  usedAtMs: integer('used_at_ms'),
})

export const passwordResets = sqliteTable('password_resets', mailedLinkColumns(), (table) => [
  index('password_resets_user_id_idx').on(table.userId),
])

/** Address confirmation links; like reset tokens, stored only as SHA-256 hashes. */
export const emailVerifications = sqliteTable(
  'email_verifications',
  mailedLinkColumns(),
  (table) => [index('email_verifications_user_id_idx').on(table.userId)],
)

/** One row per message a team sent (invitation, card), counted for the team's daily mail cap. */
export const teamMailSends = sqliteTable(
  'team_mail_sends',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    teamId: integer('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    sentAtMs: integer('sent_at_ms').notNull(),
  },
  (table) => [index('team_mail_sends_team_sent_idx').on(table.teamId, table.sentAtMs)],
)

export * from './schema-resources'
export * from './schema-events'
