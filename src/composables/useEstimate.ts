import { computed, effectScope, inject, provide, type ComputedRef, type InjectionKey } from 'vue'
import { estimate } from '@shared/engine'
import type { EstimateRequest, EstimateResult } from '@shared/schemas/estimate'
import { useRigDraftStore } from '@/stores/rigDraft'

export interface EstimateState {
  /** The latest result; while the draft is invalid, the last valid rig's result (see `stale`). */
  result: ComputedRef<EstimateResult | null>
  /** The validated request the result belongs to. */
  request: ComputedRef<EstimateRequest | null>
  /** True while the shown result belongs to an earlier, valid version of the draft. */
  stale: ComputedRef<boolean>
  /** Field path (`pack.seriesCells`, `accessories.0.powerW`) → the schema's message for it. */
  fieldIssues: ComputedRef<ReadonlyMap<string, string>>
  /** Every message, for a summary above the results. */
  issueMessages: ComputedRef<readonly string[]>
  /** Set when the engine itself failed on input that passed the schema (a bug to report). */
  engineError: ComputedRef<string | null>
}

type RigDraftStore = ReturnType<typeof useRigDraftStore>

const noIssues: ReadonlyMap<string, string> = new Map()

// One state per store, shared by every component that asks: the engine runs once per change of
// the draft, however many panels read the result.
const states = new WeakMap<RigDraftStore, EstimateState>()

function createState(store: RigDraftStore): EstimateState {
  // Detached: the state lives as long as the store, not as long as the first component using it.
  const scope = effectScope(true)
  return scope.run(() => {
    let last: { request: EstimateRequest; result: EstimateResult } | null = null
    const outcome = computed(() => {
      const validation = store.validation
      if (!validation.success || store.unreadable.size > 0) {
        return { ...last, stale: last !== null, error: null }
      }
      try {
        last = { request: validation.data, result: estimate(validation.data) }
        return { ...last, stale: false, error: null }
      } catch (error) {
        return {
          ...last,
          stale: last !== null,
          error: error instanceof Error ? error.message : String(error),
        }
      }
    })
    const fieldIssues = computed(() => {
      const validation = store.validation
      // The same empty map every time: nothing that shows messages re-renders for a valid change.
      if (validation.success && store.unreadable.size === 0) return noIssues
      // Text that is not a number comes first: it is what the field shows.
      const issues = new Map<string, string>(store.unreadable)
      for (const issue of validation.success ? [] : validation.error.issues) {
        const path = issue.path.map(String).join('.')
        // The first message for a field is the one to fix first.
        if (!issues.has(path)) issues.set(path, issue.message)
      }
      return issues
    })
    return {
      result: computed(() => outcome.value.result ?? null),
      request: computed(() => outcome.value.request ?? null),
      stale: computed(() => outcome.value.stale),
      fieldIssues,
      issueMessages: computed(() => [...fieldIssues.value.values()]),
      engineError: computed(() => outcome.value.error),
    }
  })!
}

const shownEstimateKey: InjectionKey<EstimateState> = Symbol('shown estimate')

/**
 * Gives the components below the caller another view of the estimate (one that lags while they
 * are off screen: BenchCatchUp); `useEstimate` returns it to them.
 */
export function provideShownEstimate(state: EstimateState): void {
  provide(shownEstimateKey, state)
}

/**
 * The estimate of the rig on the bench, computed in the browser (no round trip). Inside a
 * BenchCatchUp it is the estimate as that panel shows it; `useLiveEstimate` is always current.
 */
export function useEstimate(): EstimateState {
  return inject(shownEstimateKey, null) ?? useLiveEstimate()
}

/** The estimate of the rig as it is now, whatever is on screen. */
export function useLiveEstimate(): EstimateState {
  const store = useRigDraftStore()
  let state = states.get(store)
  if (!state) {
    state = createState(store)
    states.set(store, state)
  }
  return state
}
