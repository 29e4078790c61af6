import type { RequestHandler } from 'express'
import type { AppDatabase } from '../db/client'
import type { TeamRole } from '../../shared/schemas/teams'
import { roleOf } from './memberships'
import type { SessionCookie } from './session-cookie'
import type { SessionStore, SessionUser } from './sessions'

export interface RequestAuth {
  user: SessionUser
  sessionId: string
  /** The user's role in a team, read from the database at the call (never from the token). */
  roleIn(teamId: number): TeamRole | undefined
}

export interface RequestMembership {
  teamId: number
  role: TeamRole
}

declare module 'express-serve-static-core' {
  interface Request {
    /** Set by `authenticate` when the request carries a live session; see require.ts. */
    auth?: RequestAuth
    /** Set by `requireTeamRole` for the route's `:teamId`. */
    membership?: RequestMembership
  }
}

/** Reads the session cookie into `req.auth`; never refuses a request itself (require.ts does). */
export function authenticate(
  db: AppDatabase,
  store: SessionStore,
  cookie: SessionCookie,
): RequestHandler {
  return async (req, _res, next) => {
    const token: unknown = req.cookies?.[cookie.name]
    if (typeof token === 'string' && token !== '') {
      const session = await store.resolve(token)
      if (session) {
        req.auth = {
          user: session.user,
          sessionId: session.sessionId,
          roleIn: (teamId) => roleOf(db, teamId, session.user.id),
        }
      }
    }
    next()
  }
}
