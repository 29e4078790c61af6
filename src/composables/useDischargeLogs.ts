import { computed, ref, watch, type Ref } from 'vue'
import * as logsApi from '@/api/dischargeLogs'
import { packsApi } from '@/api/resources'
import type { PackItem } from '@shared/schemas/resources'
import type { DischargeLogDetail, DischargeLogSummary } from '@shared/discharge/log'
import { modelConstantCurrentDischarge } from '@shared/engine/discharge-model'
import { useHealthEffect } from './useHealthEffect'
import { useTeamAccess } from './useTeamAccess'

const messageOf = (caught: unknown, fallback: string) =>
  caught instanceof Error ? caught.message : fallback

/**
 * A saved pack, its discharge logs and the one on show, with upload (and its progress), delete
 * and accept, and what accepting the one on show changes (before and after). The model curve is the engine's pack with the log's measured health under the log's
 * average current, run here in the browser as the bench does.
 */
export function useDischargeLogs(packId: Ref<number | undefined>) {
  const { teamId, canEdit } = useTeamAccess()
  const pack = ref<PackItem | undefined>()
  const logs = ref<DischargeLogSummary[]>([])
  const selected = ref<DischargeLogDetail | undefined>()
  const loading = ref(false)
  const error = ref<string | undefined>()
  const uploadProgress = ref<number | undefined>()
  const uploadError = ref<string | undefined>()

  // The calibrated model: the pack with this log's measured health, at the log's current and to
  // its cutoff, which is what the log should be drawn over (it delivers the log's Ah).
  const model = computed(() => {
    const log = selected.value
    if (!pack.value || !log) return undefined
    return modelConstantCurrentDischarge(
      {
        ...pack.value,
        cutoffCellV: log.cutoffV / pack.value.seriesCells,
        healthPct: log.calibration ? log.healthPct : pack.value.healthPct,
      },
      log.averageCurrentA,
    )
  })
  // The pack as saved now (its own health figure), at the same current.
  const savedModel = computed(() => {
    const log = selected.value
    if (!pack.value || !log) return undefined
    return modelConstantCurrentDischarge(
      { ...pack.value, cutoffCellV: log.cutoffV / pack.value.seriesCells },
      log.averageCurrentA,
    )
  })

  function ids(): { team: number; pack: number } | undefined {
    return teamId.value === undefined || packId.value === undefined
      ? undefined
      : { team: teamId.value, pack: packId.value }
  }

  const healthEffect = useHealthEffect(ids, selected)

  async function select(logId: number): Promise<void> {
    const at = ids()
    if (!at) return
    try {
      selected.value = await logsApi.getDischargeLog(at.team, at.pack, logId)
    } catch (caught) {
      error.value = messageOf(caught, 'The log could not be loaded.')
    }
  }

  async function load(): Promise<void> {
    const at = ids()
    if (!at) return
    loading.value = true
    error.value = undefined
    try {
      const [item, list] = await Promise.all([
        packsApi.get(at.team, at.pack),
        logsApi.listDischargeLogs(at.team, at.pack),
      ])
      pack.value = item
      logs.value = list.items
      selected.value = undefined
      const newest = list.items[0]
      if (newest) await select(newest.id)
    } catch (caught) {
      error.value = messageOf(caught, 'The pack could not be loaded.')
    } finally {
      loading.value = false
    }
  }

  async function upload(file: File): Promise<boolean> {
    const at = ids()
    if (!at) return false
    uploadError.value = undefined
    uploadProgress.value = 0
    try {
      const created = await logsApi.uploadDischargeLog(at.team, at.pack, file, (fraction) => {
        uploadProgress.value = fraction
      })
      const { points: _points, ...summary } = created
      logs.value = [summary, ...logs.value]
      selected.value = created
      return true
    } catch (caught) {
      uploadError.value = messageOf(caught, 'The log could not be uploaded.')
      return false
    } finally {
      uploadProgress.value = undefined
    }
  }

  async function remove(logId: number): Promise<void> {
    const at = ids()
    if (!at) return
    await logsApi.deleteDischargeLog(at.team, at.pack, logId)
    logs.value = logs.value.filter((log) => log.id !== logId)
    if (selected.value?.id === logId) {
      selected.value = undefined
      const next = logs.value[0]
      if (next) await select(next.id)
    }
  }

  /**
   * Makes the log's health the pack's (and that of the rigs using the pack); sends the pack
   * version on show (409 if it is stale). Returns the names of the rigs that took it too.
   */
  async function accept(logId: number): Promise<string[]> {
    const at = ids()
    if (!at || !pack.value) return []
    const answer = await logsApi.acceptDischargeLog(at.team, at.pack, logId, {
      version: pack.value.version,
    })
    pack.value = answer.pack
    const { points: _points, ...summary } = answer.log
    logs.value = logs.value.map((log) => (log.id === logId ? summary : log))
    if (selected.value?.id === logId) {
      selected.value = answer.log
      healthEffect.showApplied(answer.effect)
    }
    return answer.updatedRigs.map((rig) => rig.name)
  }

  watch([teamId, packId], load, { immediate: true })

  return {
    canEdit,
    pack,
    logs,
    selected,
    model,
    savedModel,
    healthEffect,
    loading,
    error,
    uploadProgress,
    uploadError,
    load,
    select,
    upload,
    remove,
    accept,
  }
}
