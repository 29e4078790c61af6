import { fileURLToPath } from 'node:url'
import { readMigrationFiles } from 'drizzle-orm/migrator'
import { migrate } from 'drizzle-orm/better-sqlite3/migrator'
import type { DatabaseHandle } from './client'

export const migrationsFolder = fileURLToPath(new URL('../../drizzle', import.meta.url))

export interface MigrationStatus {
  applied: number
  pending: number
}

export function runMigrations({ db }: DatabaseHandle): void {
  migrate(db, { migrationsFolder })
}

/** Compares the migrations on disk with those recorded in the database (drizzle's own table). */
export function migrationStatus({ sqlite }: DatabaseHandle): MigrationStatus {
  const known = readMigrationFiles({ migrationsFolder })
  const table = sqlite
    .prepare(
      "select name from sqlite_master where type = 'table' and name = '__drizzle_migrations'",
    )
    .get()
  const appliedHashes = new Set<string>(
    table
      ? (sqlite.prepare('select hash from __drizzle_migrations').all() as { hash: string }[]).map(
          (row) => row.hash,
        )
      : [],
  )
  const applied = known.filter((migration) => appliedHashes.has(migration.hash)).length
  return { applied, pending: known.length - applied }
}
