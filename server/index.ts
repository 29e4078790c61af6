import { mkdirSync } from 'node:fs'
import { join, resolve } from 'node:path'
import { createApp } from './app'
import { openDatabase } from './db/client'
import { runMigrations, migrationStatus } from './db/migrate'
import { readEnv } from './env'
import { resolveSessionSecret } from './secret'

const env = readEnv()
const dataDir = resolve(env.LOUDHOUR_DATA_DIR)
mkdirSync(dataDir, { recursive: true })

const sessionSecret = resolveSessionSecret(dataDir, env.SESSION_SECRET)
const database = openDatabase(join(dataDir, 'loudhour.db'))
runMigrations(database)
const migrations = migrationStatus(database)

const app = createApp({ env, database, sessionSecret })
const server = app.listen(env.PORT, env.HOST, (error?: Error) => {
  if (error) {
    console.error(`Loudhour could not listen on ${env.HOST}:${env.PORT}: ${error.message}`)
    process.exit(1)
  }
  console.log(`Loudhour is running at ${env.PUBLIC_URL}`)
  console.log(`  data: ${dataDir} (migrations applied: ${migrations.applied})`)
})

let stopping = false
function shutdown(signal: string): void {
  if (stopping) return
  stopping = true
  console.log(`${signal} received: closing connections`)
  server.close(() => {
    database.sqlite.close()
    process.exit(0)
  })
  server.closeAllConnections()
  // A stuck socket must not keep the process alive for ever.
  setTimeout(() => process.exit(1), 10_000).unref()
}
process.on('SIGTERM', () => shutdown('SIGTERM'))
process.on('SIGINT', () => shutdown('SIGINT'))
