import type { Request, RequestHandler } from 'express'
import { ApiError } from '../http/errors'
import { parseRowId } from '../http/params'
import type { TeamRole } from '../../shared/schemas/teams'
import type { RequestAuth, RequestMembership } from './authenticate'
import { roleAtLeast } from './memberships'

/*
 * Guards for routes. Use them in the route table, then read the result in the handler:
 *
 *   const router = Router({ mergeParams: true })   // mounted at /v1/teams/:teamId/rigs
 *   router.get('/', requireTeamRole('viewer'), (req, res) => {
 *     const { teamId } = teamMembership(req)
 *     ...
 *   })
 *
 * Answers: 401 when signed out; 404 for a team the user is not in (or that does not exist, so
 * team ids cannot be probed); 403 when the user's role is below the one asked for.
 */

export const requireUser: RequestHandler = (req, _res, next) => {
  signedInUser(req)
  next()
}

/** Loads the signed-in user's membership of `:teamId` from the database on every request. */
export function requireTeamRole(minimum: TeamRole): RequestHandler {
  return (req, _res, next) => {
    const auth = signedInUser(req)
    const rawTeamId = req.params.teamId
    if (rawTeamId === undefined) {
      // A programming error, not a client one: the router lost the parameter.
      throw new Error(
        'requireTeamRole needs :teamId in the path (use Router({ mergeParams: true }))',
      )
    }
    const teamId = parseRowId(rawTeamId)
    const role = teamId === undefined ? undefined : auth.roleIn(teamId)
    if (teamId === undefined || role === undefined) {
      throw new ApiError(404, 'team-not-found', 'No such team, or you are not a member of it.')
    }
    if (!roleAtLeast(role, minimum)) {
      throw new ApiError(
        403,
        'role-too-low',
        `This needs the ${minimum} role in this team; yours is ${role}.`,
      )
    }
    req.membership = { teamId, role }
    next()
  }
}

/** The signed-in user; throws 401 when there is none (so it also works as a check). */
export function signedInUser(req: Request): RequestAuth {
  if (!req.auth) throw new ApiError(401, 'signed-out', 'Sign in to continue.')
  return req.auth
}

/** The membership that `requireTeamRole` loaded for this request. */
export function teamMembership(req: Request): RequestMembership {
  if (!req.membership) throw new Error('teamMembership() used on a route without requireTeamRole')
  return req.membership
}
