import { computed, type ComputedRef } from 'vue'
import { accessoriesApi, amplifiersApi, packsApi, speakersApi } from '@/api/resources'
import { partFingerprint } from '@/components/bench/partFingerprint'
import { useRigDraftStore } from '@/stores/rigDraft'
import type { LibraryItem } from '@shared/library'
import type { AccessorySpec, AmplifierSpec, PackSpec, SpeakersSpec } from '@shared/schemas/estimate'
import type { RigBody } from '@shared/schemas/resources'
import { savedPartId, useTeamParts } from './useTeamParts'

export type RigPartReferences = Pick<
  RigBody,
  'packId' | 'amplifierId' | 'speakersId' | 'accessoryIds'
>

function matchedId(
  items: readonly LibraryItem<object>[],
  part: object,
  ignoredFields: readonly string[] = [],
): number | null {
  const wanted = partFingerprint(part, ignoredFields)
  const match = items.find((item) => partFingerprint(item.part, ignoredFields) === wanted)
  return match ? (savedPartId(match.id) ?? null) : null
}

/**
 * The team's saved parts that the bench's rig uses unchanged, as a saved rig refers to them (so
 * a part in use cannot be deleted silently). A part whose values were edited on the bench no
 * longer counts. Undefined until every list has loaded: a save then keeps the references it had.
 */
export function useRigPartReferences(): ComputedRef<RigPartReferences | undefined> {
  const bench = useRigDraftStore()
  const packs = useTeamParts<PackSpec>(packsApi)
  const amplifiers = useTeamParts<AmplifierSpec>(amplifiersApi)
  const speakers = useTeamParts<SpeakersSpec>(speakersApi)
  const accessories = useTeamParts<AccessorySpec>(accessoriesApi)
  const lists = [packs, amplifiers, speakers, accessories]

  return computed(() => {
    if (!bench.validation.success || lists.some((list) => !list.ready.value)) return undefined
    const rig = bench.validation.data
    const accessoryIds = (rig.accessories ?? [])
      .map((accessory) => matchedId(accessories.items.value, accessory))
      .filter((id): id is number => id !== null)
    return {
      // The packs on hand belong to the rig, not to the saved pack.
      packId: matchedId(packs.items.value, rig.pack, ['count']),
      amplifierId: matchedId(amplifiers.items.value, rig.amplifier),
      speakersId: matchedId(speakers.items.value, rig.speakers),
      accessoryIds: [...new Set(accessoryIds)],
    }
  })
}
