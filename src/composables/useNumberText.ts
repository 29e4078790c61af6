import { onBeforeUnmount, ref } from 'vue'
import { revertedNumberNote, unreadableNumberMessage } from '@/display/numberText'

/**
 * Watches the text of one number field as typed. `unreadable` holds a message while the text is
 * not a number (the value the form holds is then the last valid one); `note` says, after the
 * field lost focus and went back to that value, what was thrown away. `report` hears every change
 * of `unreadable`, and null when the field goes away.
 */
export function useNumberText(report: (message: string | null) => void) {
  const unreadable = ref<string | null>(null)
  const note = ref<string | null>(null)
  let typed = ''

  function set(message: string | null): void {
    if (unreadable.value === message) return
    unreadable.value = message
    report(message)
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
