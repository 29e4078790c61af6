import { computed } from 'vue'
import type { DataTableSortState } from 'naive-ui'
import type { SortValue, useResourceList } from './useResourceList'

type ResourceList = Pick<ReturnType<typeof useResourceList>, 'sort' | 'page' | 'pageSize' | 'total'>

/** The sort arrows and pager of a naive-ui table over a `useResourceList` list. */
export function useListTable(list: ResourceList, defaultSort: SortValue) {
  const sortOrder = (key: string) =>
    list.sort.value === key ? 'ascend' : list.sort.value === `-${key}` ? 'descend' : false

  function sortChanged(state: DataTableSortState | DataTableSortState[] | null): void {
    const single = Array.isArray(state) ? state[0] : state
    if (!single || !single.order) list.sort.value = defaultSort
    else
      list.sort.value =
        `${single.order === 'descend' ? '-' : ''}${String(single.columnKey)}` as SortValue
  }

  const pagination = computed(() => ({
    page: list.page.value,
    pageSize: list.pageSize.value,
    itemCount: list.total.value,
    showSizePicker: true,
    pageSizes: [10, 25, 50],
    onUpdatePage: (page: number) => (list.page.value = page),
    onUpdatePageSize: (size: number) => {
      list.pageSize.value = size
      list.page.value = 1
    },
  }))

  return { sortOrder, sortChanged, pagination }
}
