import { inject, type InjectionKey } from 'vue'
import type { DialogOptions } from 'naive-ui'

/**
 * Confirmation dialogs (naive-ui's, with the same options as its `useDialog`), opened through
 * AppDialogHost, which loads the dialog code only when the first one is asked for: most visits
 * never open one, and the dialog and modal are a large part of the component library.
 */
export interface AppDialogs {
  warning: (options: DialogOptions) => void
}

export const appDialogsKey: InjectionKey<AppDialogs> = Symbol('app dialogs')

export function useAppDialog(): AppDialogs {
  const dialogs = inject(appDialogsKey, null)
  if (!dialogs) throw new Error('useAppDialog needs an AppDialogHost above the component')
  return dialogs
}
