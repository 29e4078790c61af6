import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import type { Express } from 'express'
import { createApp } from '../../server/app'
import { openDatabase, type DatabaseHandle } from '../../server/db/client'
import { runMigrations } from '../../server/db/migrate'
import { parseEnv, type Env } from '../../server/env'
import { systemClock, type Clock } from '../../server/clock'
import { createMailer, type Mailer } from '../../server/mail/mailer'
import type { Logger } from '../../server/http/log'

export interface TestApp {
  app: Express
  database: DatabaseHandle
  env: Env
  dataDir: string
  /** The built-in mail catcher unless SMTP_URL is overridden; its SMTP server starts at the first message. */
  mail: Mailer
  close: () => Promise<void>
}

export const testSessionSecret = 'test-secret-that-is-long-enough-for-hs256-0123456789'

export interface TestAppOptions {
  /** A fake clock, e.g. to step past a token's expiry. */
  clock?: Clock
  /** A logger to read what the app logs (see log-capture.ts); by default the app is silent. */
  logger?: Logger
}

/** A fresh, migrated database and the app built on it, without a port (supertest drives it). */
export function createTestApp(
  overrides: Record<string, string> = {},
  options: TestAppOptions = {},
): TestApp {
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
  const clock = options.clock ?? systemClock
  const mail = createMailer({ smtpUrl: env.SMTP_URL, from: env.MAIL_FROM, clock, log: () => {} })
  const app = createApp({
    env,
    database,
    sessionSecret: testSessionSecret,
    distDir: join(dataDir, 'no-client'),
    mail,
    clock,
    log: () => {},
    ...(options.logger ? { logger: options.logger } : {}),
  })
  return {
    app,
    database,
    env,
    dataDir,
    mail,
    close: async () => {
      await mail.close()
      database.sqlite.close()
      rmSync(dataDir, { recursive: true, force: true })
    },
  }
}
