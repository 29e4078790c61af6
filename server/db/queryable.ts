import type { RunResult } from 'better-sqlite3'
import type { BaseSQLiteDatabase } from 'drizzle-orm/sqlite-core'
import type * as schema from './schema'

/** The database or a transaction on it: helpers that take this can run inside either. */
export type Queryable = BaseSQLiteDatabase<'sync', RunResult, typeof schema>
