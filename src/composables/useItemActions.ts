import { h } from 'vue'
import { NButton, useMessage } from 'naive-ui'
import { useAppDialog } from '@/composables/useAppDialog'
import type { DetachedRigs } from '@shared/schemas/resources'

interface NamedItem {
  id: number
  name: string
}

interface ItemWrites<Item> {
  duplicate(id: number): Promise<Item>
  remove(id: number): Promise<DetachedRigs | undefined>
}

/**
 * The row actions of a list of saved items, with their confirmations and messages: duplicate,
 * delete (saying which rigs an admin's delete detached a part from), and a small button maker
 * whose accessible name starts with its visible text (WCAG 2.5.3, label in name).
 */
export function useItemActions<Item extends NamedItem>(writes: ItemWrites<Item>) {
  const dialog = useAppDialog()
  const message = useMessage()

  function failed(error: unknown): void {
    message.error(error instanceof Error ? error.message : 'That did not work; try again.', {
      duration: 8000,
    })
  }

  async function duplicate(item: Item): Promise<void> {
    try {
      const copy = await writes.duplicate(item.id)
      message.success(`Added “${copy.name}”.`)
    } catch (error) {
      failed(error)
    }
  }

  function confirmDelete(item: Item, consequence: string, afterwards?: () => void): void {
    dialog.warning({
      title: `Delete “${item.name}”?`,
      content: consequence,
      positiveText: 'Delete',
      negativeText: 'Keep it',
      onPositiveClick: async () => {
        try {
          const detached = (await writes.remove(item.id))?.detachedRigs ?? []
          afterwards?.()
          message.success(
            detached.length === 0
              ? `Deleted “${item.name}”.`
              : `Deleted “${item.name}” and detached it from ${detached.map((rig) => `“${rig.name}”`).join(', ')}.`,
            { duration: 8000 },
          )
        } catch (error) {
          failed(error)
        }
      },
    })
  }

  function rowButton(
    label: string,
    itemName: string,
    onClick: () => unknown,
    look: { type?: 'primary' | 'error'; secondary?: boolean } = {},
  ) {
    return h(
      NButton,
      { size: 'small', ...look, onClick, 'aria-label': `${label}: ${itemName}` },
      () => label,
    )
  }

  return { failed, duplicate, confirmDelete, rowButton }
}
