import { join, resolve } from 'node:path'
import { createApp } from './app'
import { openDatabase } from './db/client'
import { runMigrations, migrationStatus } from './db/migrate'
import { recomputeSummaries } from './db/recompute-summaries'
import { readEnv } from './env'
import { resolveSessionSecret } from './secret'
import { createMailer } from './mail/mailer'
import { preparePasswordChecks } from './auth/passwords'
import { demoSignIns, seedDemo } from './db/seed'
import { systemClock } from './clock'
import { ownerOnlyDir } from './owner-only'
import { stopLogParsers } from './discharge/parse-pool'

const env = readEnv()
// Whatever this process writes (the database, mail kept by the catcher) is the owner's alone.
process.umask(0o077)
const dataDir = resolve(env.LOUDHOUR_DATA_DIR)
ownerOnlyDir(dataDir)

const sessionSecret = resolveSessionSecret(dataDir, env.SESSION_SECRET)
const database = openDatabase(join(dataDir, 'loudhour.db'))
runMigrations(database)
const migrations = migrationStatus(database)
// Stored rig, plan and event summaries follow the engine: recomputed when its version changed
// (and an event's when it has none yet, saved before events stored one).
const recomputed = recomputeSummaries(database)

const mail = createMailer({
  smtpUrl: env.SMTP_URL,
  from: env.MAIL_FROM,
  clock: systemClock,
  log: (error) => console.error('Mail could not be sent:', error),
  // Only with the built-in catcher: every message it holds, for the operator's eyes.
  operatorCopy: { mailDir: join(dataDir, 'mail'), print: (text) => console.log(text) },
})
const mailCatcherPort = await mail.start()
const seeded = env.LOUDHOUR_DEMO ? await seedDemo(database, Date.now()) : false
await preparePasswordChecks()

const app = createApp({ env, database, sessionSecret, mail })
const server = app.listen(env.PORT, env.HOST, (error?: Error) => {
  if (error) {
    console.error(`Loudhour could not listen on ${env.HOST}:${env.PORT}: ${error.message}`)
    process.exit(1)
  }
  console.log(`Loudhour is running at ${env.PUBLIC_URL}`)
  console.log(`  data: ${dataDir} (migrations applied: ${migrations.applied})`)
  if (recomputed) {
    console.log(
      `  engine ${recomputed.toVersion}: recomputed ${recomputed.rigs} rig, ${recomputed.plans} plan and ${recomputed.events} event summaries (${recomputed.invalid} no longer valid)`,
    )
  }
  if (mailCatcherPort !== undefined) {
    console.log(
      `  mail: no SMTP_URL, so messages stay in the local catcher (127.0.0.1:${mailCatcherPort});`,
    )
    console.log(`        printed here and kept in ${join(dataDir, 'mail')} as .eml files;`)
    console.log(
      `        team admins read their team's mail at ${env.PUBLIC_URL}/outbox (no reset links)`,
    )
  }
  if (env.LOUDHOUR_DEMO) {
    console.log(
      seeded ? '  demo data seeded; sign in as:' : '  demo sign-ins (unless changed since):',
    )
    for (const signIn of demoSignIns()) {
      console.log(`    ${signIn.email}  ${signIn.password}  ${signIn.teams}`)
    }
  }
})

let stopping = false
function shutdown(signal: string): void {
  if (stopping) return
  stopping = true
  console.log(`${signal} received: closing connections`)
  server.close(() => {
    void Promise.allSettled([mail.close(), stopLogParsers()]).finally(() => {
      database.sqlite.close()
      process.exit(0)
    })
  })
  server.closeAllConnections()
  // A stuck socket must not keep the process alive for ever.
  setTimeout(() => process.exit(1), 10_000).unref()
}
process.on('SIGTERM', () => shutdown('SIGTERM'))
process.on('SIGINT', () => shutdown('SIGINT'))
