import type { RequestHandler } from 'express'
import type { Queryable } from '../db/queryable'
import { ApiError } from '../http/errors'
import { isEmailVerified } from './email-verifications'
import { signedInUser } from './require'

/**
 * Only an account whose owner has shown they read its mailbox may make the app mail others
 * (invitations, cards): otherwise anyone could sign up with a made-up address and use the app
 * as a mailer under the product's name. Place after requireTeamRole (a stranger still gets 404).
 */
export function requireVerifiedSender(db: Queryable): RequestHandler {
  return (req, _res, next) => {
    const { user } = signedInUser(req)
    if (!isEmailVerified(db, user.id)) {
      throw new ApiError(
        403,
        'email-unverified',
        `Confirm your address (${user.email}) before sending mail from Loudhour: open the link we mailed you, or have it sent again from your account page.`,
      )
    }
    next()
  }
}
