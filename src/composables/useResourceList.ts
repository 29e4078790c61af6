import { computed, ref, watch } from 'vue'
import type { DataTableSortState } from 'naive-ui'
import type { ResourceApi } from '@/api/resources'
import type { DetachedRigs, SortField } from '@shared/schemas/resources'
import { useTeamAccess } from './useTeamAccess'

export type SortValue = SortField | `-${SortField}`

const searchDelayMs = 250

/**
 * One page of a team's saved items with paging, sort and search, plus the writes a list offers
 * (save, duplicate, delete), each followed by a reload. `loading`, `error` and `empty` are for
 * the view's states.
 */
export function useResourceList<
  Item extends { id: number },
  Body,
  ListItem extends { id: number } = Item,
>(api: ResourceApi<Item, Body, ListItem>, defaults: { sort: SortValue; pageSize?: number }) {
  const { teamId } = useTeamAccess()
  const items = ref<ListItem[]>([]) as { value: ListItem[] }
  const total = ref(0)
  const loading = ref(false)
  const error = ref<string | undefined>()
  const page = ref(1)
  const pageSize = ref(defaults.pageSize ?? 10)
  const sort = ref<SortValue>(defaults.sort)
  const search = ref('')
  let latestRequest = 0

  async function reload(): Promise<void> {
    const team = teamId.value
    if (team === undefined) return
    const request = ++latestRequest
    loading.value = true
    try {
      const answer = await api.list(team, {
        limit: pageSize.value,
        offset: (page.value - 1) * pageSize.value,
        sort: sort.value,
        q: search.value.trim() || undefined,
      })
      // A slower, older answer must not overwrite a newer one.
      if (request !== latestRequest) return
      items.value = answer.items
      total.value = answer.total
      error.value = undefined
    } catch (caught) {
      if (request !== latestRequest) return
      error.value = caught instanceof Error ? caught.message : 'The list could not be loaded.'
    } finally {
      if (request === latestRequest) loading.value = false
    }
  }

  watch([teamId, page, pageSize, sort], () => void reload(), { immediate: true })
  let searchTimer: ReturnType<typeof setTimeout> | undefined
  watch(search, () => {
    clearTimeout(searchTimer)
    searchTimer = setTimeout(() => {
      if (page.value === 1) void reload()
      else page.value = 1
    }, searchDelayMs)
  })

  const empty = computed(() => !loading.value && !error.value && total.value === 0)

  // What a remote naive-ui data table needs: paging and the sort shown on its column headers.
  const pagination = computed(() => ({
    page: page.value,
    pageSize: pageSize.value,
    itemCount: total.value,
    showSizePicker: true,
    pageSizes: [10, 25, 50],
    onUpdatePage: (next: number) => (page.value = next),
    onUpdatePageSize: (size: number) => {
      pageSize.value = size
      page.value = 1
    },
  }))

  function sortOrder(key: SortField): 'ascend' | 'descend' | false {
    return sort.value === key ? 'ascend' : sort.value === `-${key}` ? 'descend' : false
  }

  function sortFromTable(state: DataTableSortState | DataTableSortState[] | null): void {
    const single = Array.isArray(state) ? state[0] : state
    sort.value = single?.order
      ? (`${single.order === 'descend' ? '-' : ''}${String(single.columnKey)}` as SortValue)
      : defaults.sort
  }

  function requireTeam(): number {
    if (teamId.value === undefined) throw new Error('Choose a team first.')
    return teamId.value
  }

  async function save(body: Body, existing?: { id: number; version: number }): Promise<Item> {
    const team = requireTeam()
    const saved = existing
      ? await api.update(team, existing.id, { ...body, version: existing.version })
      : await api.create(team, body)
    await reload()
    return saved
  }

  async function duplicate(id: number): Promise<Item> {
    const copy = await api.duplicate(requireTeam(), id)
    await reload()
    return copy
  }

  async function remove(id: number): Promise<DetachedRigs | undefined> {
    const outcome = await api.remove(requireTeam(), id)
    await reload()
    return outcome
  }

  return {
    teamId,
    items,
    total,
    loading,
    error,
    empty,
    pagination,
    sortOrder,
    sortFromTable,
    page,
    pageSize,
    sort,
    search,
    reload,
    save,
    duplicate,
    remove,
  }
}
