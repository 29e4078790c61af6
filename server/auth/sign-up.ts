import type { SignUpInput } from '../../shared/schemas/auth'
import type { MailMessage } from '../mail/message'
import { accountExistsMail, emailVerificationMail, linkTo, pageAt } from '../mail/templates'
import { createAccount, findUserByEmail } from './accounts'
import type { AccountsContext } from './context'
import { issueEmailVerification } from './email-verifications'
import { hashPassword } from './passwords'

/**
 * The work of a sign-up, done after the answer has gone (the same answer for every address): a
 * new address gets an account and a confirmation link; one that has an account is told so, with
 * the way to a reset, and nothing about the account changes.
 */
export async function completeSignUp(
  context: Pick<AccountsContext, 'db' | 'clock' | 'publicUrl'>,
  input: SignUpInput,
): Promise<MailMessage> {
  const { db, clock, publicUrl } = context
  const remind = () =>
    accountExistsMail({ to: input.email, url: pageAt(publicUrl, '/forgot-password') })
  if (findUserByEmail(db, input.email)) return remind()
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
    if (findUserByEmail(db, input.email)) return remind()
    throw error
  }
  const token = issueEmailVerification(db, userId, clock().getTime())
  return emailVerificationMail({ to: input.email, url: linkTo(publicUrl, '/verify-email', token) })
}
