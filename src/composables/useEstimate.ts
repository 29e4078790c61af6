import { inject, provide, toRef, type InjectionKey, type Ref } from 'vue'
import type { EstimateRequest, EstimateResult } from '@shared/schemas/estimate'
import { useRigDraftStore } from '@/stores/rigDraft'

/** The estimate of the rig on the bench, as the rig draft store computes it. */
export interface EstimateState {
  /** The latest result; while the draft is invalid, the last valid rig's result (see `stale`). */
  result: Readonly<Ref<EstimateResult | null>>
  /** The validated request the result belongs to. */
  request: Readonly<Ref<EstimateRequest | null>>
  /** True while the shown result belongs to an earlier, valid version of the draft. */
  stale: Readonly<Ref<boolean>>
  /** Field path (`pack.seriesCells`, `accessories.0.powerW`) → the schema's message for it. */
  fieldIssues: Readonly<Ref<ReadonlyMap<string, string>>>
  /** Every message, for a summary above the results. */
  issueMessages: Readonly<Ref<readonly string[]>>
  /** Set when the engine itself failed on input that passed the schema (a bug to report). */
  engineError: Readonly<Ref<string | null>>
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

/** The estimate of the rig as it is now, whatever is on screen: refs to the store's state. */
export function useLiveEstimate(): EstimateState {
  const store = useRigDraftStore()
  return {
    result: toRef(store, 'result'),
    request: toRef(store, 'request'),
    stale: toRef(store, 'stale'),
    fieldIssues: toRef(store, 'fieldIssues'),
    issueMessages: toRef(store, 'issueMessages'),
    engineError: toRef(store, 'engineError'),
  }
}
