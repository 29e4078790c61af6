import { ZxcvbnFactory } from '@zxcvbn-ts/core'
import * as zxcvbnCommon from '@zxcvbn-ts/language-common'
import { ApiError } from '../http/errors'

// Offline: the common-password list, names and keyboard graphs ship inside the package.
const checker = new ZxcvbnFactory({
  dictionary: { ...zxcvbnCommon.dictionary },
  graphs: zxcvbnCommon.adjacencyGraphs,
})

// zxcvbn score 3 is "safely unguessable: moderate protection from offline slow-hash attacks"
// (zxcvbn README, score definitions); 2 and below fall to a throttled online guesser in days.
const minimumScore = 3
// zxcvbn warning keys (translationKeys.ts) meaning the password is on or near a common-password list.
const commonListWarnings = new Set(['topTen', 'topHundred', 'common', 'similarToCommon'])

/**
 * Refuses common and guessable passwords with a 400 naming the field. `related` holds words the
 * attacker knows (the address, the name, the product) so that "alex.loudhour2026" scores low.
 */
export function assertPasswordStrong(
  password: string,
  related: string[],
  field = 'password',
): void {
  const result = checker.check(password, ['loudhour', ...related.flatMap(splitWords)])
  if (result.score >= minimumScore) return
  const message = commonListWarnings.has(result.feedback.warning ?? '')
    ? 'This password is on lists of common passwords; choose a longer phrase of unrelated words'
    : 'This password is too easy to guess; choose a longer phrase of unrelated words'
  throw new ApiError(400, 'weak-password', `${field}: ${message}`, [{ path: field, message }])
}

function splitWords(value: string): string[] {
  return value
    .toLowerCase()
    .split(/[^a-z0-9]+/)
    .filter((word) => word.length >= 3)
}
