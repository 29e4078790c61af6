import type { SignUpInput } from '../../shared/schemas/auth'
import type { MailMessage } from '../mail/message'
import { accountExistsMail, emailVerificationMail, linkTo, pageAt } from '../mail/templates'
import { createAccount, findUserByEmail } from './accounts'
import type { AccountsContext } from './context'
import { issueEmailVerification } from './email-verifications'
import { hashPassword } from './passwords'

/** What a sign-up did: the mail to send, and the account the address belongs to now. */
export interface SignUpOutcome {
  mail: MailMessage
  accountId: number
  /** False when the address had an account already (it is only reminded). */
  accountCreated: boolean
}

/**
 * The work of a sign-up, done after the answer has gone (the same answer for every address): a
 * new address gets an account and a confirmation link; one that has an account is told so, with
 * the way to a reset, and nothing about the account changes.
 */
export async function completeSignUp(
  context: Pick<AccountsContext, 'db' | 'clock' | 'publicUrl'>,
  input: SignUpInput,
): Promise<SignUpOutcome> {
  const { db, clock, publicUrl } = context
  const remind = (accountId: number): SignUpOutcome => ({
    mail: accountExistsMail({ to: input.email, url: pageAt(publicUrl, '/forgot-password') }),
    accountId,
    accountCreated: false,
  })
  const existing = findUserByEmail(db, input.email)
  if (existing) return remind(existing.id)
  const passwordHash = await hashPassword(input.password)
  let userId: number
  try {
    userId = createAccount(
      db,
      { email: input.email, name: input.name, passwordHash },
      clock().getTime(),
    )
  } catch (error) {
    // Two sign-ups with one address at once: the unique index lets only one through.
    const winner = findUserByEmail(db, input.email)
    if (winner) return remind(winner.id)
    throw error
  }
  const token = issueEmailVerification(db, userId, clock().getTime())
  return {
    mail: emailVerificationMail({
      to: input.email,
      url: linkTo(publicUrl, '/verify-email', token),
    }),
    accountId: userId,
    accountCreated: true,
  }
}
