// How guessable a new password is, judged the same way by the form's meter (in the browser) and by
// the server, which refuses what does not pass.
import { ZxcvbnFactory } from '@zxcvbn-ts/core'
import * as zxcvbnCommon from '@zxcvbn-ts/language-common'

// Offline: the common-password list, names and keyboard graphs ship inside the package.
const checker = new ZxcvbnFactory({
  dictionary: { ...zxcvbnCommon.dictionary },
  graphs: zxcvbnCommon.adjacencyGraphs,
})

/**
 * zxcvbn score 3 is "safely unguessable: moderate protection from offline slow-hash attacks"
 * (zxcvbn README, score definitions); 2 and below fall to a throttled online guesser in days.
 */
export const MINIMUM_PASSWORD_SCORE = 3
export const MAXIMUM_PASSWORD_SCORE = 4

// zxcvbn warning keys (translationKeys.ts) meaning the password is on or near a common-password list.
const commonListWarnings = new Set(['topTen', 'topHundred', 'common', 'similarToCommon'])

export interface PasswordJudgement {
  /** zxcvbn's score, 0 (guessed at once) to 4 (very unguessable). */
  score: number
  acceptable: boolean
  /** One plain sentence: what is wrong and what to do, or that it will do. */
  message: string
}

/**
 * `related` holds words an attacker knows (the address, the name): "alex.loudhour2026" scores low
 * for Alex. The product's own name always counts as known.
 */
export function judgePassword(password: string, related: readonly string[]): PasswordJudgement {
  const result = checker.check(password, ['loudhour', ...related.flatMap(splitWords)])
  const score = result.score
  if (score >= MINIMUM_PASSWORD_SCORE) {
    return {
      score,
      acceptable: true,
      message: score >= MAXIMUM_PASSWORD_SCORE ? 'Very hard to guess' : 'Hard enough to guess',
    }
  }
  return {
    score,
    acceptable: false,
    message: commonListWarnings.has(result.feedback.warning ?? '')
      ? 'This password is on lists of common passwords; choose a longer phrase of unrelated words'
      : 'This password is too easy to guess; choose a longer phrase of unrelated words',
  }
}

function splitWords(value: string): string[] {
  return value
    .toLowerCase()
    .split(/[^a-z0-9]+/)
    .filter((word) => word.length >= 3)
}
