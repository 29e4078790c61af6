import { computed } from 'vue'
import type { ResourceApi } from '@/api/resources'
import type { LibraryItem } from '@shared/library'
import { LIST_LIMIT_MAX, type SavedItemMeta } from '@shared/schemas/resources'
import { useResourceList } from './useResourceList'

/** Prefix of a team part's picker id, so it never collides with a built-in library id. */
const teamIdPrefix = 'team-'

/** The saved part's id behind a picker id from `useTeamParts`, or undefined for a library id. */
export function savedPartId(pickerId: string): number | undefined {
  return pickerId.startsWith(teamIdPrefix) ? Number(pickerId.slice(teamIdPrefix.length)) : undefined
}

/** The part as the estimate request holds it: a saved part's spec without what the team keeps. */
export function partOfItem<Part>(item: SavedItemMeta & Part): Part {
  const {
    id: _id,
    version: _version,
    name: _name,
    notes: _notes,
    createdAt: _createdAt,
    updatedAt: _updatedAt,
    createdBy: _createdBy,
    updatedBy: _updatedBy,
    ...part
  } = item
  return part as Part
}

/**
 * The current team's saved parts of one kind, shaped like built-in library items so the bench's
 * pickers take both. Signed out or without a team nothing is asked; a failed list leaves only the
 * built-in library and a short note for the picker.
 */
export function useTeamParts<Part>(api: ResourceApi<SavedItemMeta & Part, unknown>) {
  // One page of the largest size the server allows; a crew's own parts fit in it.
  const list = useResourceList(api, { sort: 'name', pageSize: LIST_LIMIT_MAX })

  const items = computed<LibraryItem<Part>[]>(() =>
    list.teamId.value === undefined || list.error.value
      ? []
      : list.items.value.map((item) => ({
          id: `${teamIdPrefix}${item.id}`,
          label: item.name,
          part: partOfItem<Part>(item),
        })),
  )
  const note = computed(() =>
    list.teamId.value !== undefined && list.error.value
      ? "Your team's parts could not be loaded; the built-in library is listed."
      : undefined,
  )

  // Loaded without an error: only then does a missing match mean the part is not the team's.
  const ready = computed(
    () => list.teamId.value !== undefined && !list.loading.value && !list.error.value,
  )

  return { items, note, ready }
}
