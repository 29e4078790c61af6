import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import type { Express } from 'express'
import { createApp } from '../../server/app'
import { openDatabase, type DatabaseHandle } from '../../server/db/client'
import { runMigrations } from '../../server/db/migrate'
import { parseEnv, type Env } from '../../server/env'

export interface TestApp {
  app: Express
  database: DatabaseHandle
  env: Env
  dataDir: string
  close: () => void
}

/** A fresh, migrated database and the app built on it, without a port (supertest drives it). */
export function createTestApp(overrides: Record<string, string> = {}): TestApp {
  const dataDir = mkdtempSync(join(tmpdir(), 'loudhour-test-'))
  const env = parseEnv({
    NODE_ENV: 'test',
    LOUDHOUR_DATA_DIR: dataDir,
    PUBLIC_URL: 'http://localhost:3999',
    LOUDHOUR_DEMO: 'false',
    ...overrides,
  })
  const database = openDatabase(join(dataDir, 'test.db'))
  runMigrations(database)
  const app = createApp({
    env,
    database,
    sessionSecret: 'test-secret-that-is-long-enough-for-hs256-0123456789',
    distDir: join(dataDir, 'no-client'),
    log: () => {},
  })
  return {
    app,
    database,
    env,
    dataDir,
    close: () => {
      database.sqlite.close()
      rmSync(dataDir, { recursive: true, force: true })
    },
  }
}
