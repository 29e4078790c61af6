import { and, eq } from 'drizzle-orm'
import type { AppDatabase } from '../db/client'
import type { Queryable } from '../db/queryable'
import { dischargeLogs, packs } from '../db/schema-resources'
import { ApiError } from '../http/errors'
import { itemMeta, peopleOf } from '../resources/owned-table'
import { carryPackHealthToRigs, packHealthEffect } from '../resources/pack-health'
import { packDefinition } from '../resources/packs'
import type { WriteActor } from '../resources/resource-definition'
import type { PackHealthEffect } from '../../shared/discharge/health-effect'
import type { AcceptDischargeLogInput, DischargeLogDetail } from '../../shared/discharge/log'
import { packSchema } from '../../shared/schemas/estimate'
import type { PackItem } from '../../shared/schemas/resources'
import {
  dischargeLogDetail,
  logNotFound,
  noteFor,
  requireLog,
  requirePack,
  summaryOf,
  volts,
  type PackRow,
  type PackScope,
} from './pack-logs'

// The pack's health figure is kept to one decimal, as it is typed in the pack form.
const roundHealthPct = (value: number) => Math.round(value * 10) / 10

/**
 * The health figure a log gives the pack as saved now, or a 400 saying why it gives none: a log
 * that stops above the cutoff, one that a new pack of this spec could not have given, or a figure
 * the pack could not be saved with.
 */
function measuredHealthPct(tx: Queryable, scope: PackScope, logId: number, pack: PackRow): number {
  const found = requireLog(tx, scope, logId)
  const { analysis } = found.log
  if (!analysis.reachedCutoff) {
    throw new ApiError(400, 'log-incomplete', noteFor(analysis) ?? logNotFound)
  }
  const measured = summaryOf(found, pack)
  if (measured.calibration === null) {
    throw new ApiError(
      400,
      'log-not-comparable',
      `A new pack of this spec would not deliver any charge at the log's ${measured.averageCurrentA.toFixed(2)} A down to ${volts(measured.cutoffV)}, so the log cannot be turned into a health figure. Check the pack's cells in series, cutoff per cell and cell resistance. Nothing was written.`,
    )
  }
  const healthPct = roundHealthPct(measured.healthPct)
  const checked = packSchema.safeParse({ ...pack.spec, healthPct })
  if (!checked.success) {
    const issue = checked.error.issues[0]
    throw new ApiError(
      400,
      'health-out-of-range',
      `This log's health figure cannot be saved with the pack: ${issue?.message ?? 'it is out of range'}. Check the pack's cells and capacity, or the log. Nothing was written.`,
      [{ path: 'healthPct', message: issue?.message ?? 'Out of range' }],
    )
  }
  return healthPct
}

/** Which rigs and plans would take the log's health figure if it were accepted now, and which not. */
export function previewAcceptLog(tx: Queryable, scope: PackScope, logId: number): PackHealthEffect {
  const pack = requirePack(tx, scope)
  return packHealthEffect(tx, scope.teamId, pack, measuredHealthPct(tx, scope, logId, pack))
}

export interface AcceptedLog {
  pack: PackItem
  log: DischargeLogDetail
  /** The rigs that took the figure (the same as `effect.rigs.changing`, by id and name). */
  updatedRigs: { id: number; name: string }[]
  effect: PackHealthEffect
}

function packItemOf(tx: Queryable, row: PackRow): PackItem {
  return packDefinition.toItem(tx, row, itemMeta(row, peopleOf(tx, [row]))) as PackItem
}

/**
 * Makes the log's health figure the pack's, and that of the rigs the effect names, in one
 * transaction (pack and rig versions + 1; their plans are worked out again). `version`, when
 * sent, is the pack version the user saw: another is 409 and nothing is written.
 */
export function acceptDischargeLog(
  db: AppDatabase,
  scope: PackScope,
  logId: number,
  input: AcceptDischargeLogInput,
  actor: WriteActor,
): AcceptedLog {
  return db.transaction((tx) => {
    const pack = requirePack(tx, scope)
    requireLog(tx, scope, logId)
    if (input.version !== undefined && input.version !== pack.version) {
      throw new ApiError(
        409,
        'stale-version',
        `Someone else saved this pack after you opened it: you sent version ${input.version}, the saved one is version ${pack.version}. Nothing was written.`,
      )
    }
    const healthPct = measuredHealthPct(tx, scope, logId, pack)
    const effect = packHealthEffect(tx, scope.teamId, pack, healthPct)
    tx.update(packs)
      .set({
        spec: { ...pack.spec, healthPct },
        version: pack.version + 1,
        updatedAtMs: actor.nowMs,
        updatedByUserId: actor.userId,
      })
      .where(and(eq(packs.id, pack.id), eq(packs.version, pack.version)))
      .run()
    tx.update(dischargeLogs)
      .set({ acceptedAtMs: actor.nowMs })
      .where(eq(dischargeLogs.id, logId))
      .run()
    carryPackHealthToRigs(tx, effect, actor)
    return {
      pack: packItemOf(tx, requirePack(tx, scope)),
      log: dischargeLogDetail(tx, scope, logId),
      updatedRigs: effect.rigs.changing.map(({ id, name }) => ({ id, name })),
      effect,
    }
  })
}
