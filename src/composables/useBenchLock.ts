import { computed, ref } from 'vue'
import { useTeamAccess } from '@/composables/useTeamAccess'
import { useSavedRigStore } from '@/stores/savedRig'

/** The saved rig a viewer chose to try changes on; its fields stay open for this visit. */
const triedRigId = ref<number | null>(null)

/**
 * A viewer who opens one of the team's saved rigs sees its fields read-only, as on a plan,
 * until they choose to try changes (which they can never save). Changes already on the bench
 * keep the fields open: locking them would hide work the viewer is doing.
 */
export function useBenchLock() {
  const saved = useSavedRigStore()
  const { role } = useTeamAccess()
  const locked = computed(() => {
    const link = saved.link
    return (
      link !== null &&
      role.value === 'viewer' &&
      triedRigId.value !== link.rigId &&
      !saved.hasUnsavedChanges
    )
  })
  function tryChanges(): void {
    triedRigId.value = saved.link?.rigId ?? null
  }
  return { locked, tryChanges }
}
