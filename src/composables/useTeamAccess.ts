import { computed } from 'vue'
import { useSessionStore } from '@/stores/session'

/** The team the app works in and what the signed-in user may do there (viewers read only). */
export function useTeamAccess() {
  const session = useSessionStore()
  const teamId = computed(() => session.currentTeamId)
  const role = computed(() => session.currentTeam?.role)
  const canEdit = computed(() => role.value === 'editor' || role.value === 'admin')
  const isAdmin = computed(() => role.value === 'admin')
  return { teamId, role, canEdit, isAdmin }
}
