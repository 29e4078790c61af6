import { onBeforeUnmount, onMounted } from 'vue'
import { onBeforeRouteLeave, onBeforeRouteUpdate } from 'vue-router'
import { useAppDialog } from './useAppDialog'

/**
 * Asks before leaving a page whose work is not saved: a dialog for moves inside the app, the
 * browser's own prompt for closing or reloading the tab. `describe` says what would be lost.
 */
export function useUnsavedChangesGuard(unsaved: () => boolean, describe: () => string): void {
  const dialog = useAppDialog()

  function confirmLeaving(): Promise<boolean> {
    return new Promise((resolve) => {
      dialog.warning({
        title: 'Leave without saving?',
        content: describe(),
        positiveText: 'Leave',
        negativeText: 'Stay',
        onPositiveClick: () => resolve(true),
        onNegativeClick: () => resolve(false),
        onClose: () => resolve(false),
        onMaskClick: () => resolve(false),
      })
    })
  }

  const guard = () => (unsaved() ? confirmLeaving() : true)
  onBeforeRouteLeave(guard)
  // The same page for another item (one plan to the next) is a leave too.
  onBeforeRouteUpdate((to, from) => (to.path === from.path ? true : guard()))

  function warnBeforeUnload(event: BeforeUnloadEvent): void {
    if (!unsaved()) return
    event.preventDefault()
    // Older browsers show the prompt only when returnValue is set.
    event.returnValue = ''
  }
  onMounted(() => window.addEventListener('beforeunload', warnBeforeUnload))
  onBeforeUnmount(() => window.removeEventListener('beforeunload', warnBeforeUnload))
}
