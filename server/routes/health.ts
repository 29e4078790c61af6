import { Router } from 'express'
import type { DatabaseHandle } from '../db/client'
import { migrationStatus } from '../db/migrate'
import { appVersion } from '../version'

export function healthRouter(database: DatabaseHandle): Router {
  const router = Router()
  router.get('/', (_req, res) => {
    const migrations = migrationStatus(database)
    res.json({ ok: migrations.pending === 0, version: appVersion, migrations })
  })
  return router
}
