import Database from 'better-sqlite3'
import { drizzle, type BetterSQLite3Database } from 'drizzle-orm/better-sqlite3'
import { ownerOnlyFile, tightenIfPresent } from '../owner-only'
import * as schema from './schema'

export type AppDatabase = BetterSQLite3Database<typeof schema>
export interface DatabaseHandle {
  sqlite: Database.Database
  db: AppDatabase
}

/**
 * Opens (or creates) the SQLite file with the pragmas every connection needs. `:memory:` works
 * for tests.
 */
export function openDatabase(file: string): DatabaseHandle {
  const onDisk = file !== ':memory:' && file !== ''
  // SQLite gives its -wal and -shm files the database file's mode (os_unix.c, findCreateFileMode).
  if (onDisk) ownerOnlyFile(file)
  const sqlite = new Database(file)
  // WAL lets readers continue during a write; FULL makes an acknowledged write survive power loss.
  sqlite.pragma('journal_mode = WAL')
  sqlite.pragma('synchronous = FULL')
  sqlite.pragma('foreign_keys = ON')
  sqlite.pragma('busy_timeout = 5000')
  if (onDisk) for (const suffix of ['-wal', '-shm']) tightenIfPresent(file + suffix)
  return { sqlite, db: drizzle(sqlite, { schema }) }
}
