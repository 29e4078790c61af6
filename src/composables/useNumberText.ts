import { inject, onBeforeUnmount, provide, ref, useId, type InjectionKey } from 'vue'
import { revertedNumberNote, unreadableNumberMessage } from '@/display/numberText'

/** Hears, for each number field below a page (by an id of the field's own), its unreadable text. */
export type NumberTextReport = (fieldId: string, message: string | null) => void

const reportKey: InjectionKey<NumberTextReport> = Symbol('number text report')

/** Lets a page (a plan, a part) mark its results while any field below it holds no number. */
export function provideNumberTextReport(report: NumberTextReport): void {
  provide(reportKey, report)
}

/**
 * Watches the text of one number field as typed. `unreadable` holds a message while the text is
 * not a number (the value the form holds is then the last valid one); `note` says, after the
 * field lost focus and went back to that value, what was thrown away. `report` hears every change
 * of `unreadable`, and null when the field goes away; without it, the page's report does
 * (`provideNumberTextReport`).
 */
export function useNumberText(report?: (message: string | null) => void) {
  const pageReport = inject(reportKey, null)
  const fieldId = useId()
  const tell = report ?? ((message: string | null) => pageReport?.(fieldId, message))
  const unreadable = ref<string | null>(null)
  const note = ref<string | null>(null)
  let typed = ''

  function set(message: string | null): void {
    if (unreadable.value === message) return
    unreadable.value = message
    tell(message)
  }
  function onInput(event: Event): void {
    typed = (event.target as HTMLInputElement).value
    note.value = null
    set(unreadableNumberMessage(typed))
  }
  function onBlur(): void {
    if (unreadable.value === null) return
    note.value = revertedNumberNote(typed)
    set(null)
  }
  onBeforeUnmount(() => set(null))
  return { unreadable, note, onInput, onBlur }
}
