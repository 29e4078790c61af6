import { judgePassword } from '../../shared/auth/password-strength'
import { ApiError } from '../http/errors'

/**
 * Refuses common and guessable passwords with a 400 naming the field (the rule the forms' meter
 * shows while typing: shared/auth/password-strength.ts).
 */
export function assertPasswordStrong(
  password: string,
  related: string[],
  field = 'password',
): void {
  const judgement = judgePassword(password, related)
  if (judgement.acceptable) return
  const message = judgement.message
  throw new ApiError(400, 'weak-password', `${field}: ${message}`, [{ path: field, message }])
}
