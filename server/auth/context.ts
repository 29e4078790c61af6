import type { AppDatabase } from '../db/client'
import type { Clock } from '../clock'
import type { Env } from '../env'
import type { Mailer } from '../mail/mailer'
import type { SessionCookie } from './session-cookie'
import type { SessionStore } from './sessions'

/** What the account, team and invitation routes share; built once in createApp. */
export interface AccountsContext {
  db: AppDatabase
  publicUrl: Env['PUBLIC_URL']
  clock: Clock
  sessions: SessionStore
  cookie: SessionCookie
  mail: Mailer
  /** TEAM_MAIL_DAILY_LIMIT: messages a team may send in a rolling day. */
  teamMailDailyLimit: number
  log: (error: unknown) => void
}
