import { computed, type Ref } from 'vue'
import { suggestFixes } from '@shared/engine'
import { libraryPacks } from '@shared/library'
import { clockLabel } from '@shared/plans/clock'
import { segmentEnergies } from '@shared/plans/segment-energy'
import type { EstimateResult, PackSpec } from '@shared/schemas/estimate'
import type { PackItem } from '@shared/schemas/resources'
import type { CheckedPlan } from './usePlanEditor'

/** A pack the plan can be compared on or switched to: built-in, or one of the team's own. */
export interface CandidatePack {
  key: string
  label: string
  source: 'team' | 'library'
  /** The team pack's id (kept as the rig's reference when picked), null for built-in packs. */
  packId: number | null
  spec: PackSpec
}

export function candidatePacks(teamPacks: readonly PackItem[]): CandidatePack[] {
  const team = teamPacks.map((item): CandidatePack => {
    const {
      id,
      version: _v,
      name,
      notes: _n,
      createdAt: _c,
      updatedAt: _u,
      createdBy: _cb,
      updatedBy: _ub,
      ...spec
    } = item
    return {
      key: `team-${id}`,
      label: name,
      source: 'team',
      packId: id,
      spec: { ...spec, label: name },
    }
  })
  const library = libraryPacks.map((item): CandidatePack => ({
    key: `library-${item.id}`,
    label: item.label,
    source: 'library',
    packId: null,
    spec: item.part,
  }))
  return [...team, ...library]
}

/**
 * What the page shows of the day the plan editor worked out (the same engine the server runs at
 * save): swaps on the event clock, energy per segment, and fixes when the day does not last.
 * `plan` is the one the result belongs to, so all of it is the same plan's, valid or last valid.
 */
export function usePlanResult(
  result: Readonly<Ref<EstimateResult | null>>,
  plan: Readonly<Ref<CheckedPlan | null>>,
  candidates: Readonly<Ref<readonly CandidatePack[]>>,
) {
  const request = computed(() => plan.value?.request ?? null)
  const swaps = computed(() => {
    const startTime = plan.value?.body.startTime
    const planned = result.value?.schedule?.swaps ?? []
    if (startTime === undefined) return []
    return planned.map((swap) => ({ ...swap, atTime: clockLabel(startTime, swap.atMinute) }))
  })
  const segments = computed(() => (request.value ? segmentEnergies(request.value) : []))
  const fixes = computed(() => {
    if (!request.value || !result.value?.schedule || result.value.schedule.lasts) return null
    return suggestFixes(
      request.value,
      candidates.value.map((candidate) => candidate.spec),
    )
  })
  return { swaps, segments, fixes }
}
