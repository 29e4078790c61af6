import { ref, watch, type Ref } from 'vue'
import { previewAcceptDischargeLog } from '@/api/dischargeLogs'
import type { PackHealthEffect } from '@shared/discharge/health-effect'
import type { DischargeLogDetail } from '@shared/discharge/log'

/**
 * What accepting the log on show would change (which rigs and plans take its health figure, and
 * why the others do not), asked of the server whenever another log is shown; after an accept,
 * what it did change. A log that stops above its cutoff gives no figure: nothing is asked.
 */
export function useHealthEffect(
  ids: () => { team: number; pack: number } | undefined,
  selected: Ref<DischargeLogDetail | undefined>,
) {
  const effect = ref<PackHealthEffect | undefined>()
  const error = ref<string | undefined>()
  const applied = ref(false)

  async function load(log: DischargeLogDetail | undefined): Promise<void> {
    effect.value = undefined
    error.value = undefined
    applied.value = false
    const at = ids()
    if (!at || !log?.reachedCutoff) return
    try {
      const answer = await previewAcceptDischargeLog(at.team, at.pack, log.id)
      // Another log may have been chosen while this one was asked about.
      if (selected.value?.id === log.id) effect.value = answer
    } catch (caught) {
      if (selected.value?.id !== log.id) return
      error.value =
        caught instanceof Error
          ? caught.message
          : 'What the figure would change could not be loaded.'
    }
  }

  /** Shows what an accept did, in place of the preview. */
  function showApplied(done: PackHealthEffect): void {
    effect.value = done
    error.value = undefined
    applied.value = true
  }

  watch(
    () => selected.value?.id,
    () => load(selected.value),
  )

  return { effect, error, applied, showApplied }
}
