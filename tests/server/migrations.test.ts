import { cpSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { migrate } from 'drizzle-orm/better-sqlite3/migrator'
import { afterEach, describe, expect, it } from 'vitest'
import { openDatabase, type DatabaseHandle } from '../../server/db/client'
import { migrationsFolder, migrationStatus, runMigrations } from '../../server/db/migrate'
import { recomputeSummaries } from '../../server/db/recompute-summaries'
import { seedPlanFixture } from '../helpers/plan-fixture'
import { seedResourceFixture } from '../helpers/resource-fixture'

// Migrations applied to databases that already hold data: the accounts first, then the parts,
// rigs and plans on top, then a restart (migrate again) with parts and rigs in place.

interface Journal {
  entries: { tag: string }[]
}

const cleanups: (() => void)[] = []
afterEach(() => {
  for (const cleanup of cleanups.splice(0)) cleanup()
})

const journal = JSON.parse(
  readFileSync(join(migrationsFolder, 'meta', '_journal.json'), 'utf8'),
) as Journal

/** A copy of the migrations folder holding the migrations up to the one whose tag starts so. */
function migrationsUpTo(tagPrefix: string): string {
  const folder = mkdtempSync(join(tmpdir(), 'loudhour-migrations-'))
  cleanups.push(() => rmSync(folder, { recursive: true, force: true }))
  const last = journal.entries.findIndex((entry) => entry.tag.startsWith(tagPrefix))
  if (last < 0) throw new Error(`No migration ${tagPrefix}*`)
  const kept = journal.entries.slice(0, last + 1)
  mkdirSync(join(folder, 'meta'))
  writeFileSync(
    join(folder, 'meta', '_journal.json'),
    JSON.stringify({ ...journal, entries: kept }),
  )
  for (const entry of kept)
    cpSync(join(migrationsFolder, `${entry.tag}.sql`), join(folder, `${entry.tag}.sql`))
  return folder
}

function freshDatabase(): DatabaseHandle {
  const dir = mkdtempSync(join(tmpdir(), 'loudhour-migrate-'))
  const database = openDatabase(join(dir, 'test.db'))
  cleanups.push(() => {
    database.sqlite.close()
    rmSync(dir, { recursive: true, force: true })
  })
  return database
}

function rowCounts({ sqlite }: DatabaseHandle, tables: string[]): Record<string, number> {
  return Object.fromEntries(
    tables.map((table) => [
      table,
      (sqlite.prepare(`select count(*) as n from ${table}`).get() as { n: number }).n,
    ]),
  )
}

/**
 * A user and a team, as the accounts tables of the first release hold them. Plain SQL naming
 * only the columns that release had: Drizzle's insert would name every column of today's schema.
 */
function insertCrew({ sqlite }: DatabaseHandle, nowMs: number) {
  const userId = Number(
    sqlite
      .prepare(
        'insert into users (email, name, password_hash, created_at_ms, updated_at_ms) values (?, ?, ?, ?, ?)',
      )
      .run('kai@crew.example', 'Kai', 'x', nowMs, nowMs).lastInsertRowid,
  )
  const teamId = Number(
    sqlite
      .prepare('insert into teams (name, created_at_ms, updated_at_ms) values (?, ?, ?)')
      .run('Crew', nowMs, nowMs).lastInsertRowid,
  )
  sqlite
    .prepare('insert into memberships (team_id, user_id, role, created_at_ms) values (?, ?, ?, ?)')
    .run(teamId, userId, 'admin', nowMs)
  return { userId, teamId }
}

const foreignKeyProblems = ({ sqlite }: DatabaseHandle) =>
  sqlite.prepare('pragma foreign_key_check').all()

describe('the parts, rigs and plans migration', () => {
  it('applies over a database that holds teams and users, and keeps them', () => {
    const database = freshDatabase()
    // Up to the accounts migration, as an installation of the previous release holds it.
    migrate(database.db, { migrationsFolder: migrationsUpTo('0001_') })
    const nowMs = Date.now()
    const { userId, teamId } = insertCrew(database, nowMs)
    expect(migrationStatus(database).pending).toBeGreaterThan(0)

    runMigrations(database)
    expect(migrationStatus(database).pending).toBe(0)
    expect(rowCounts(database, ['users', 'teams', 'memberships'])).toEqual({
      users: 1,
      teams: 1,
      memberships: 1,
    })
    seedResourceFixture(database.db, teamId, userId, nowMs)
    expect(foreignKeyProblems(database)).toEqual([])
  })

  it('leaves parts and rigs in place when migrations run again at the next start', () => {
    const database = freshDatabase()
    runMigrations(database)
    const nowMs = Date.now()
    const { userId, teamId } = insertCrew(database, nowMs)
    seedResourceFixture(database.db, teamId, userId, nowMs)
    seedResourceFixture(database.db, teamId, userId, nowMs)
    const tables = ['packs', 'amplifiers', 'speakers', 'accessories', 'rigs', 'rig_accessories']
    const before = rowCounts(database, tables)
    expect(before).toEqual({
      packs: 2,
      amplifiers: 2,
      speakers: 2,
      accessories: 2,
      rigs: 2,
      rig_accessories: 2,
    })

    runMigrations(database)
    expect(rowCounts(database, tables)).toEqual(before)
    expect(foreignKeyProblems(database)).toEqual([])
  })

  it('declares RESTRICT on the references from rigs to their parts, and CASCADE where data belongs to its parent', () => {
    const database = freshDatabase()
    runMigrations(database)
    const onDelete = (table: string) =>
      Object.fromEntries(
        (
          database.sqlite.prepare(`pragma foreign_key_list(${table})`).all() as {
            from: string
            on_delete: string
          }[]
        ).map((key) => [key.from, key.on_delete]),
      )
    expect(onDelete('rigs')).toMatchObject({
      pack_id: 'RESTRICT',
      amplifier_id: 'RESTRICT',
      speakers_id: 'RESTRICT',
      team_id: 'CASCADE',
    })
    expect(onDelete('rig_accessories')).toMatchObject({
      rig_id: 'CASCADE',
      accessory_id: 'RESTRICT',
    })
    expect(onDelete('plans')).toMatchObject({ rig_id: 'RESTRICT' })
    expect(onDelete('share_links')).toMatchObject({ plan_id: 'CASCADE' })
    expect(onDelete('discharge_logs')).toMatchObject({ pack_id: 'CASCADE' })
  })
})

describe('the mail privacy migration', () => {
  it('adds the confirmation and mail-count tables over a database in use, keeping every row', () => {
    const database = freshDatabase()
    migrate(database.db, { migrationsFolder: migrationsUpTo('0003_') })
    const nowMs = Date.now()
    const { userId, teamId } = insertCrew(database, nowMs)
    seedResourceFixture(database.db, teamId, userId, nowMs)
    const tables = ['users', 'teams', 'memberships', 'packs', 'rigs', 'rig_accessories']
    const before = rowCounts(database, tables)

    runMigrations(database)
    expect(migrationStatus(database).pending).toBe(0)
    expect(rowCounts(database, tables)).toEqual(before)
    // Accounts made before it have never shown that they read their mail: they confirm first.
    expect(database.sqlite.prepare('select email_verified_at_ms as at from users').all()).toEqual([
      { at: null },
    ])
    expect(rowCounts(database, ['email_verifications', 'team_mail_sends'])).toEqual({
      email_verifications: 0,
      team_mail_sends: 0,
    })
    // The new tables hang off the old ones: deleting the team takes its mail counts with it.
    database.sqlite
      .prepare('insert into team_mail_sends (team_id, sent_at_ms) values (?, ?)')
      .run(teamId, nowMs)
    expect(foreignKeyProblems(database)).toEqual([])
  })
})

describe('the event summaries migration', () => {
  it('adds the summary columns over saved events, and the next start fills them in', () => {
    const database = freshDatabase()
    migrate(database.db, { migrationsFolder: migrationsUpTo('0004_') })
    const nowMs = Date.now()
    const { userId, teamId } = insertCrew(database, nowMs)
    const { planId } = seedPlanFixture(database.db, teamId, userId, nowMs)
    // An event as the events release stored it: plain SQL naming only that release's columns.
    const eventId = Number(
      database.sqlite
        .prepare(
          'insert into events (team_id, name, date, pool, chargers, created_at_ms, updated_at_ms) values (?, ?, ?, ?, ?, ?, ?)',
        )
        .run(teamId, 'Sports day', '2026-06-13', '[]', '[]', nowMs, nowMs).lastInsertRowid,
    )
    database.sqlite
      .prepare('insert into event_plans (event_id, plan_id, position) values (?, ?, 0)')
      .run(eventId, Number(planId))

    runMigrations(database)
    const stored = () =>
      database.sqlite
        .prepare('select summary, summary_engine_version as version from events where id = ?')
        .get(eventId) as { summary: string | null; version: string | null }
    expect(stored()).toEqual({ summary: null, version: null })

    // What the server does at start: an event with no summary gets one (a backfill).
    expect(recomputeSummaries(database)?.events).toBe(1)
    const after = stored()
    expect(after.version).not.toBeNull()
    // One plan in the event; the plan fixture's pack is 10 Li-ion cells in series, 2 in parallel,
    // 2.5 Ah each (the kind is named by that build).
    expect(JSON.parse(after.summary!)).toMatchObject({
      rigCount: 1,
      packsToBring: [{ kind: 'li-ion/10s2p/2.5ah', onHand: 0 }],
    })
    expect(foreignKeyProblems(database)).toEqual([])
  })
})
