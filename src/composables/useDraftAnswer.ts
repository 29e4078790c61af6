import { computed, type ComputedRef } from 'vue'

/** What a draft being edited answers to: the latest answer, or the last valid draft's. */
export interface DraftAnswer<Input, Answer> {
  /** The answer; while the draft is not valid, the last valid draft's (see `stale`). */
  answer: ComputedRef<Answer | null>
  /** The valid input the answer belongs to. */
  input: ComputedRef<Input | null>
  /** True while the answer shown belongs to an earlier, valid version of the draft. */
  stale: ComputedRef<boolean>
  /** Set when the work itself failed on input that passed the schema (a bug to report). */
  error: ComputedRef<string | null>
}

interface Outcome<Input, Answer> {
  last: { input: Input; answer: Answer } | null
  stale: boolean
  error: string | null
}

/**
 * Computed state for a draft (the rig on the bench, a plan's day): runs `work` once for each
 * valid version of the draft and keeps the last answer while the draft is not valid. The last
 * answer is the computed's own previous value, so nothing is written while computing and the
 * answer lives exactly as long as the scope that made it (a store, a page).
 *
 * `valid` returns the checked input, or null while the draft does not pass (or a field holds text
 * that is not a number). The input must be a new object only when the draft changed (a zod parse
 * kept in a computed): the same input is never worked out twice.
 */
export function useDraftAnswer<Input, Answer>(
  valid: () => Input | null,
  work: (input: Input) => Answer,
): DraftAnswer<Input, Answer> {
  const outcome = computed<Outcome<Input, Answer>>((previous) => {
    const input = valid()
    const last = previous?.last ?? null
    if (input === null) return { last, stale: last !== null, error: null }
    // Back to the input last worked out (a field's unreadable text fixed without a change).
    if (last !== null && last.input === input) return { last, stale: false, error: null }
    try {
      return { last: { input, answer: work(input) }, stale: false, error: null }
    } catch (error) {
      return {
        last,
        stale: last !== null,
        error: error instanceof Error ? error.message : String(error),
      }
    }
  })
  return {
    answer: computed(() => outcome.value.last?.answer ?? null),
    input: computed(() => outcome.value.last?.input ?? null),
    stale: computed(() => outcome.value.stale),
    error: computed(() => outcome.value.error),
  }
}
