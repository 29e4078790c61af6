import { Router, type Request } from 'express'
import { eq } from 'drizzle-orm'
import {
  emailSchema,
  emailVerificationConfirmSchema,
  passwordChangeSchema,
  passwordResetConfirmSchema,
  passwordResetRequestSchema,
  profileUpdateSchema,
  signInSchema,
  signUpSchema,
} from '../../shared/schemas/auth'
import { findUserByEmail, findUserById, replacePassword } from '../auth/accounts'
import type { AccountsContext } from '../auth/context'
import { meResponse, signIn } from '../auth/me'
import {
  confirmEmailVerification,
  isEmailVerified,
  issueEmailVerification,
} from '../auth/email-verifications'
import { completeSignUp } from '../auth/sign-up'
import type { SignUpAccepted } from '../../shared/schemas/account-responses'
import {
  completePasswordReset,
  findPendingReset,
  issuePasswordReset,
} from '../auth/password-resets'
import { invalidLinkToken } from '../auth/link-tokens'
import { assertPasswordStrong } from '../auth/password-strength'
import { hashPassword, verifyPassword } from '../auth/passwords'
import { requireUser, signedInUser } from '../auth/require'
import { users } from '../db/schema'
import { ApiError, parseInput } from '../http/errors'
import { securityEvent } from '../http/log'
import { addressKey, delayAfterFailures, hourMs, throttle } from '../http/throttle'
import { emailVerificationMail, linkTo, passwordResetMail } from '../mail/templates'

const quarterHourMs = 15 * 60 * 1000

/** The normalised address in the body, as the per-account limiters count it. */
function bodyEmail(req: Request): string | undefined {
  const parsed = emailSchema.safeParse((req.body as { email?: unknown } | undefined)?.email)
  return parsed.success ? `account:${parsed.data}` : undefined
}

function accountAtAddress(req: Request): string | undefined {
  const account = bodyEmail(req)
  return account && `${account}|${addressKey(req)}`
}

// OWASP Authentication Cheat Sheet ("Login Throttling"): count failures per source and per
// account, and prefer delays to lockouts. Refusals (429) are per address and per account-and-
// address, so wrong passwords from elsewhere never stop the owner signing in from theirs; across
// all addresses an account is only slowed. A school behind one address signs in its whole staff:
// correct passwords are not counted at all.
const signInThrottles = () => [
  throttle({
    name: 'sign_in_address',
    windowMs: quarterHourMs,
    limit: 30,
    key: 'address',
    countFailuresOnly: true,
    message: 'Too many failed sign-ins from this address. Wait a few minutes and try again.',
  }),
  // Ten wrong passwords per quarter hour per account and address: ~1,000 guesses a day at most.
  throttle({
    name: 'sign_in_account_address',
    windowMs: quarterHourMs,
    limit: 10,
    key: accountAtAddress,
    countFailuresOnly: true,
    message:
      'Too many failed sign-ins for this account from here. Wait a few minutes, or reset the password.',
  }),
  // Guesses spread over many addresses: from the 11th failure on, each attempt waits 0.5 s more,
  // at most 5 s (the owner's correct password still gets through, a little later).
  delayAfterFailures({
    name: 'sign_in_account',
    windowMs: quarterHourMs,
    freeFailures: 10,
    stepMs: 500,
    maxDelayMs: 5000,
    key: bodyEmail,
  }),
]

// Guesses at the current password from a session someone else holds: five per quarter hour.
const passwordChangeThrottle = () =>
  throttle({
    name: 'password_change_account',
    windowMs: quarterHourMs,
    limit: 5,
    key: (req) => (req.auth ? `user:${req.auth.user.id}` : undefined),
    countFailuresOnly: true,
    message:
      'Too many wrong current passwords. Wait a few minutes, or sign out and reset the password.',
  })

// Reset requests send mail: keep one address from flooding an inbox or the mail server.
const resetThrottles = () => [
  throttle({
    name: 'reset_address',
    windowMs: hourMs,
    limit: 20,
    key: 'address',
    message: 'Too many reset requests from this address. Wait a while and try again.',
  }),
  throttle({
    name: 'reset_account',
    windowMs: hourMs,
    limit: 5,
    key: bodyEmail,
    message:
      'Several reset links were sent to this address already. Check the inbox, or wait an hour.',
  }),
]

const signUpThrottles = () => [
  throttle({
    name: 'sign_up_address',
    windowMs: hourMs,
    limit: 30,
    key: 'address',
    message: 'Too many new accounts from this address. Wait a while and try again.',
  }),
  // Each sign-up mails the address: keep strangers from flooding someone's inbox with them.
  throttle({
    name: 'sign_up_account',
    windowMs: hourMs,
    limit: 5,
    key: bodyEmail,
    message: 'Several messages went to this address already. Check the inbox, or wait an hour.',
  }),
]

const resendVerificationThrottle = () =>
  throttle({
    name: 'email_verification_account',
    windowMs: hourMs,
    limit: 5,
    key: (req) => (req.auth ? String(req.auth.user.id) : undefined),
    message: 'Several links went to this address already. Check the inbox, or wait an hour.',
  })

const wrongCredentials = () =>
  new ApiError(
    401,
    'wrong-credentials',
    'That e-mail address and password do not match an account.',
  )

export function authRouter(context: AccountsContext): Router {
  const { db, clock, sessions, cookie, mail } = context
  const router = Router()

  // The same 202 for a new address and one with an account (the answer must not tell which):
  // everything that differs between the two happens after it, in completeSignUp. The account
  // signs in once made; it sends mail to others once its address is confirmed.
  router.post('/sign-up', ...signUpThrottles(), (req, res) => {
    const input = parseInput(signUpSchema, req.body)
    assertPasswordStrong(input.password, [input.email, input.name])
    const answer: SignUpAccepted = {
      message: `Check your mail at ${input.email}: the message there says how to go on.`,
    }
    res.status(202).json(answer)
    mail.sendInBackground(async () => {
      const outcome = await completeSignUp(context, input)
      // Logged after the answer, like a reset request: many sign-ups naming existing accounts
      // from one address is how someone tests which addresses have one.
      securityEvent(req, 'sign-up', {
        accountId: outcome.accountId,
        accountCreated: outcome.accountCreated,
      })
      return outcome.mail
    })
  })

  router.post('/sign-in', ...signInThrottles(), async (req, res) => {
    const input = parseInput(signInSchema, req.body)
    const user = findUserByEmail(db, input.email)
    const matches = await verifyPassword(user?.passwordHash, input.password)
    if (!user || !matches) {
      // The account only: a typed address may be a password typed into the wrong field.
      securityEvent(req, 'sign-in-failed', { accountId: user?.id ?? null })
      throw wrongCredentials()
    }
    await signIn(context, res, user.id)
    res.json(meResponse(context, user.id))
  })

  router.post('/sign-out', (req, res) => {
    if (req.auth) sessions.end(req.auth.sessionId)
    cookie.clear(res)
    res.status(204).end()
  })

  router.post('/sign-out-everywhere', requireUser, (req, res) => {
    sessions.endAllForUser(signedInUser(req).user.id)
    cookie.clear(res)
    res.status(204).end()
  })

  router.get('/me', requireUser, (req, res) => {
    res.json(meResponse(context, signedInUser(req).user.id))
  })

  // For the client's first look: answers 200 either way, so a signed-out visit logs no error.
  router.get('/session', (req, res) => {
    res.json({ session: req.auth ? meResponse(context, req.auth.user.id) : null })
  })

  router.patch('/me', requireUser, (req, res) => {
    const { user } = signedInUser(req)
    const input = parseInput(profileUpdateSchema, req.body)
    db.update(users)
      .set({ name: input.name, updatedAtMs: clock().getTime() })
      .where(eq(users.id, user.id))
      .run()
    res.json(meResponse(context, user.id))
  })

  // Changing the password ends every session, this one included, then signs this browser in again.
  router.post('/password', requireUser, passwordChangeThrottle(), async (req, res) => {
    const { user } = signedInUser(req)
    const input = parseInput(passwordChangeSchema, req.body)
    const stored = findUserById(db, user.id)
    if (!(await verifyPassword(stored?.passwordHash, input.currentPassword))) {
      const message = 'This is not the current password'
      throw new ApiError(400, 'wrong-password', `currentPassword: ${message}`, [
        { path: 'currentPassword', message },
      ])
    }
    assertPasswordStrong(input.newPassword, [user.email, user.name], 'newPassword')
    replacePassword(db, user.id, await hashPassword(input.newPassword), clock().getTime())
    securityEvent(req, 'password-changed')
    await signIn(context, res, user.id)
    res.json(meResponse(context, user.id))
  })

  // 202 whatever the address, answered before anything is looked up: the account lookup, the
  // token and the mail all happen afterwards, so neither the answer nor its timing tells whether
  // an account exists.
  router.post('/password-reset', ...resetThrottles(), (req, res) => {
    const input = parseInput(passwordResetRequestSchema, req.body)
    res.status(202).json({ message: 'If an account has this address, a reset link is on its way.' })
    mail.sendInBackground(async () => {
      const user = findUserByEmail(db, input.email)
      // Logged after the answer too: the lookup it names is part of the work kept off the clock.
      securityEvent(req, 'password-reset-requested', { accountId: user?.id ?? null })
      if (!user) return undefined
      const token = issuePasswordReset(db, user.id, clock().getTime())
      return passwordResetMail({
        to: user.email,
        url: linkTo(context.publicUrl, '/reset-password', token),
      })
    })
  })

  router.post('/password-reset/confirm', async (req, res) => {
    const input = parseInput(passwordResetConfirmSchema, req.body)
    const reset = findPendingReset(db, input.token, clock().getTime())
    if (!reset) throw invalidLinkToken('reset')
    assertPasswordStrong(input.password, [reset.email, reset.name])
    const passwordHash = await hashPassword(input.password)
    if (!completePasswordReset(db, reset, passwordHash, clock().getTime()))
      throw invalidLinkToken('reset')
    securityEvent(req, 'password-reset-completed', { accountId: reset.userId })
    res.status(204).end()
  })

  // Sends a new confirmation link to the signed-in account's own address.
  router.post('/email-verification', requireUser, resendVerificationThrottle(), (req, res) => {
    const { user } = signedInUser(req)
    if (isEmailVerified(db, user.id)) {
      throw new ApiError(409, 'already-verified', 'This address is confirmed already.')
    }
    const token = issueEmailVerification(db, user.id, clock().getTime())
    securityEvent(req, 'email-verification-resent')
    mail.sendInBackground(
      emailVerificationMail({
        to: user.email,
        url: linkTo(context.publicUrl, '/verify-email', token),
      }),
    )
    res.status(202).json({ message: `A new link is on its way to ${user.email}.` })
  })

  // The link itself is the proof: it works signed in or out (the mail may be read on a phone).
  router.post('/email-verification/confirm', (req, res) => {
    const { token } = parseInput(emailVerificationConfirmSchema, req.body)
    const userId = confirmEmailVerification(db, token, clock().getTime())
    if (userId === undefined) throw invalidLinkToken('confirmation')
    securityEvent(req, 'email-verified', { accountId: userId })
    res.status(204).end()
  })

  return router
}
