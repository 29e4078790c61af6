import { and, desc, eq } from 'drizzle-orm'
import type { AppDatabase } from '../db/client'
import type { Queryable } from '../db/queryable'
import { users } from '../db/schema'
import { dischargeLogs, packs } from '../db/schema-resources'
import { ApiError } from '../http/errors'
import { calibrationOf } from './calibration'
import type {
  DischargeFigures,
  DischargeLogDetail,
  DischargeLogSummary,
} from '../../shared/discharge/log'

/*
 * A pack's stored discharge logs as the API shows them: looked up within the team and the pack
 * (a log asked for under another pack or team is not found), with their health figures worked
 * out against the pack as saved now.
 */

export type LogRow = typeof dischargeLogs.$inferSelect
export type PackRow = typeof packs.$inferSelect
export interface FoundLog {
  log: LogRow
  uploaderName: string | null
}

/** Which team's pack, and (when one is named) which of its logs. */
export interface PackScope {
  teamId: number
  packId: number
}

export const packNotFound = 'No such pack in this team.'
export const logNotFound = 'No such discharge log for this pack.'

export function requirePack(tx: Queryable, { teamId, packId }: PackScope): PackRow {
  const row = tx
    .select()
    .from(packs)
    .where(and(eq(packs.teamId, teamId), eq(packs.id, packId)))
    .get()
  if (!row) throw new ApiError(404, 'not-found', packNotFound)
  return row
}

function logsOfPack(tx: Queryable, { teamId, packId }: PackScope, logId?: number) {
  const conditions = [eq(dischargeLogs.teamId, teamId), eq(dischargeLogs.packId, packId)]
  if (logId !== undefined) conditions.push(eq(dischargeLogs.id, logId))
  return tx
    .select({ log: dischargeLogs, uploaderName: users.name })
    .from(dischargeLogs)
    .leftJoin(users, eq(users.id, dischargeLogs.uploadedByUserId))
    .where(and(...conditions))
    .orderBy(desc(dischargeLogs.createdAtMs), desc(dischargeLogs.id))
}

export function requireLog(tx: Queryable, scope: PackScope, logId: number): FoundLog {
  const found = logsOfPack(tx, scope, logId).get()
  if (!found) throw new ApiError(404, 'not-found', logNotFound)
  return found
}

export const volts = (value: number) => `${value.toFixed(2)} V`

/** A plain sentence when the figures need a caveat; null when they do not. */
export function noteFor(figures: DischargeFigures): string | null {
  if (figures.reachedCutoff && figures.durationS === 0) {
    return `The log starts at or below the pack's cutoff of ${volts(figures.cutoffV)}, so nothing was counted. Check that the log is of this pack and that its cells in series and cutoff per cell are right.`
  }
  if (figures.reachedCutoff) return null
  return `The log ends at ${volts(figures.endVoltageV)}, above the pack's cutoff of ${volts(figures.cutoffV)}: the pack was not run down to its cutoff, so the figures are a lower bound and its health figure cannot be accepted.`
}

export function summaryOf({ log, uploaderName }: FoundLog, pack: PackRow): DischargeLogSummary {
  return {
    ...log.analysis,
    ...calibrationOf(log.analysis, pack.spec),
    id: log.id,
    packId: log.packId,
    fileName: log.fileName,
    createdAt: new Date(log.createdAtMs).toISOString(),
    uploadedBy:
      log.uploadedByUserId !== null && uploaderName !== null
        ? { id: log.uploadedByUserId, name: uploaderName }
        : null,
    acceptedAt: log.acceptedAtMs === null ? null : new Date(log.acceptedAtMs).toISOString(),
    note: noteFor(log.analysis),
  }
}

/** One log of the pack with its points; 404 when the pack or the log is not there. */
export function dischargeLogDetail(
  tx: Queryable,
  scope: PackScope,
  logId: number,
): DischargeLogDetail {
  const pack = requirePack(tx, scope)
  const found = requireLog(tx, scope, logId)
  return { ...summaryOf(found, pack), points: found.log.points }
}

/** The pack's logs, newest first, without points. */
export function dischargeLogList(
  tx: Queryable,
  scope: PackScope,
): { items: DischargeLogSummary[]; total: number } {
  const pack = requirePack(tx, scope)
  const items = logsOfPack(tx, scope)
    .all()
    .map((row) => summaryOf(row, pack))
  return { items, total: items.length }
}

/** Deletes one log (a health figure it gave the pack stays); 404 when it is not there. */
export function deleteDischargeLog(db: AppDatabase, scope: PackScope, logId: number): void {
  db.transaction((tx) => {
    requirePack(tx, scope)
    requireLog(tx, scope, logId)
    tx.delete(dischargeLogs).where(eq(dischargeLogs.id, logId)).run()
  })
}
