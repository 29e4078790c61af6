import { Router, type Request } from 'express'
import { and, desc, eq } from 'drizzle-orm'
import { requireTeamRole, signedInUser, teamMembership } from '../auth/require'
import type { Queryable } from '../db/queryable'
import { users } from '../db/schema'
import { dischargeLogs, packs } from '../db/schema-resources'
import { calibrationOf } from '../discharge/calibration'
import { analyseLogOffThread } from '../discharge/parse-pool'
import { receiveLogFile } from '../discharge/upload'
import { limitConcurrent } from '../http/concurrency'
import { ApiError, parseInput } from '../http/errors'
import { securityEvent } from '../http/log'
import { rowIdParam } from '../http/params'
import { itemMeta, peopleOf } from '../resources/owned-table'
import type { ResourceContext } from '../resources/resource-definition'
import { packDefinition } from '../resources/packs'
import { carryPackHealthToRigs } from '../resources/rigs'
import {
  DISCHARGE_LOG_FIELD,
  acceptDischargeLogSchema,
  type DischargeFigures,
  type DischargeLogDetail,
  type DischargeLogSummary,
} from '../../shared/discharge/log'
import { dischargeLimitsOf } from '../../shared/engine/discharge-model'
import { packSchema } from '../../shared/schemas/estimate'
import type { PackItem } from '../../shared/schemas/resources'

/*
 * A pack's measured discharges, mounted at `/api/v1/teams/:teamId/packs/:packId/discharge-logs`:
 *
 *   POST   /                editor  multipart `file` (CSV) → 201 log with its points
 *   GET    /                viewer  → { items, total }, newest first, without points
 *   GET    /:logId          viewer  → log with its points
 *   DELETE /:logId          editor  → 204 (a health figure already accepted stays with the pack)
 *   POST   /:logId/accept   editor  { version? } → { pack, log, updatedRigs }: the pack's health
 *                                   figure becomes the log's, and so does that of the rigs using
 *                                   the pack, in one transaction (pack and rig versions + 1)
 */

type LogRow = typeof dischargeLogs.$inferSelect
type PackRow = typeof packs.$inferSelect

const packNotFound = 'No such pack in this team.'
const logNotFound = 'No such discharge log for this pack.'
const fallbackFileName = 'discharge-log.csv'

function requirePack(tx: Queryable, teamId: number, packId: number): PackRow {
  const row = tx
    .select()
    .from(packs)
    .where(and(eq(packs.teamId, teamId), eq(packs.id, packId)))
    .get()
  if (!row) throw new ApiError(404, 'not-found', packNotFound)
  return row
}

function logsOfPack(tx: Queryable, teamId: number, packId: number, logId?: number) {
  const conditions = [eq(dischargeLogs.teamId, teamId), eq(dischargeLogs.packId, packId)]
  if (logId !== undefined) conditions.push(eq(dischargeLogs.id, logId))
  return tx
    .select({ log: dischargeLogs, uploaderName: users.name })
    .from(dischargeLogs)
    .leftJoin(users, eq(users.id, dischargeLogs.uploadedByUserId))
    .where(and(...conditions))
    .orderBy(desc(dischargeLogs.createdAtMs), desc(dischargeLogs.id))
}

function requireLog(tx: Queryable, teamId: number, packId: number, logId: number) {
  const found = logsOfPack(tx, teamId, packId, logId).get()
  if (!found) throw new ApiError(404, 'not-found', logNotFound)
  return found
}

const volts = (value: number) => `${value.toFixed(2)} V`

function noteFor(figures: DischargeFigures): string | null {
  if (figures.reachedCutoff && figures.durationS === 0) {
    return `The log starts at or below the pack's cutoff of ${volts(figures.cutoffV)}, so nothing was counted. Check that the log is of this pack and that its cells in series and cutoff per cell are right.`
  }
  if (figures.reachedCutoff) return null
  return `The log ends at ${volts(figures.endVoltageV)}, above the pack's cutoff of ${volts(figures.cutoffV)}: the pack was not run down to its cutoff, so the figures are a lower bound and its health figure cannot be accepted.`
}

function summaryOf(
  row: { log: LogRow; uploaderName: string | null },
  pack: PackRow,
): DischargeLogSummary {
  const { log } = row
  return {
    ...log.analysis,
    ...calibrationOf(log.analysis, pack.spec),
    id: log.id,
    packId: log.packId,
    fileName: log.fileName,
    createdAt: new Date(log.createdAtMs).toISOString(),
    uploadedBy:
      log.uploadedByUserId !== null && row.uploaderName !== null
        ? { id: log.uploadedByUserId, name: row.uploaderName }
        : null,
    acceptedAt: log.acceptedAtMs === null ? null : new Date(log.acceptedAtMs).toISOString(),
    note: noteFor(log.analysis),
  }
}

function detailOf(
  row: { log: LogRow; uploaderName: string | null },
  pack: PackRow,
): DischargeLogDetail {
  return { ...summaryOf(row, pack), points: row.log.points }
}

/** The client's file name, without folders or control characters, at most 200 characters. */
function cleanFileName(raw: string | undefined): string {
  const base = (raw ?? '').split(/[\\/]/).pop() ?? ''
  const cleaned = base.replace(/[\u0000-\u001f\u007f]/g, '').trim()
  return cleaned === '' ? fallbackFileName : cleaned.slice(0, 200)
}

function packItemOf(tx: Queryable, row: PackRow): PackItem {
  return packDefinition.toItem(tx, row, itemMeta(row, peopleOf(tx, [row]))) as PackItem
}

// The pack's health figure is kept to one decimal, as it is typed in the pack form.
const roundHealthPct = (value: number) => Math.round(value * 10) / 10

// Two uploads in progress per account: enough for a second tab, not enough to crowd out others.
const uploadsPerAccount = 2

export function dischargeLogsRouter(context: ResourceContext): Router {
  const { db, clock } = context
  const uploadSlots = limitConcurrent({
    limit: uploadsPerAccount,
    key: (req) => (req.auth ? `user:${req.auth.user.id}` : undefined),
    message: `At most ${uploadsPerAccount} logs upload at once for one account. Wait for one to finish, then send this one again.`,
    retryAfterS: 5,
  })
  const router = Router({ mergeParams: true })
  const packIdOf = (req: Request) => rowIdParam(req, 'packId', packNotFound)
  const logIdOf = (req: Request) => rowIdParam(req, 'logId', logNotFound)
  const teamIdOf = (req: Request) => teamMembership(req).teamId

  router.post(
    '/',
    requireTeamRole('editor'),
    // The pack is looked up before the file is read, so a wrong pack costs no upload.
    (req, _res, next) => {
      requirePack(db, teamIdOf(req), packIdOf(req))
      next()
    },
    uploadSlots,
    receiveLogFile,
    async (req, res) => {
      const teamId = teamIdOf(req)
      const packId = packIdOf(req)
      const file = req.file
      if (!file) {
        throw new ApiError(
          400,
          'invalid-upload',
          `Attach the log as a CSV file in the multipart form field "${DISCHARGE_LOG_FIELD}".`,
          [{ path: DISCHARGE_LOG_FIELD, message: 'Choose a CSV file' }],
        )
      }
      const limits = dischargeLimitsOf(requirePack(db, teamId, packId).spec)
      const { analysis, points } = await analyseLogOffThread(file.buffer, limits)
      const nowMs = clock().getTime()
      const userId = signedInUser(req).user.id
      const created = db.transaction((tx) => {
        const pack = requirePack(tx, teamId, packId)
        const limitsNow = dischargeLimitsOf(pack.spec)
        // The pack was edited while its log was read: its figures were worked out for the old one.
        if (limitsNow.cutoffV !== limits.cutoffV || limitsNow.ratedAh !== limits.ratedAh) {
          throw new ApiError(
            409,
            'pack-changed',
            'The pack was changed while its log was being read. Nothing was stored; send the log again.',
          )
        }
        const { id } = tx
          .insert(dischargeLogs)
          .values({
            packId,
            teamId,
            fileName: cleanFileName(file.originalname),
            uploadedByUserId: userId,
            createdAtMs: nowMs,
            analysis,
            points,
          })
          .returning({ id: dischargeLogs.id })
          .get()
        return detailOf(requireLog(tx, teamId, packId, id), pack)
      })
      securityEvent(req, 'discharge-log-uploaded', {
        teamId,
        packId,
        logId: created.id,
        bytes: file.size,
      })
      res.status(201).json(created)
    },
  )

  router.get('/', requireTeamRole('viewer'), (req, res) => {
    const teamId = teamIdOf(req)
    const packId = packIdOf(req)
    const pack = requirePack(db, teamId, packId)
    const items = logsOfPack(db, teamId, packId)
      .all()
      .map((row) => summaryOf(row, pack))
    res.json({ items, total: items.length })
  })

  router.get('/:logId', requireTeamRole('viewer'), (req, res) => {
    const teamId = teamIdOf(req)
    const packId = packIdOf(req)
    const pack = requirePack(db, teamId, packId)
    res.json(detailOf(requireLog(db, teamId, packId, logIdOf(req)), pack))
  })

  router.delete('/:logId', requireTeamRole('editor'), (req, res) => {
    const teamId = teamIdOf(req)
    const packId = packIdOf(req)
    const logId = logIdOf(req)
    db.transaction((tx) => {
      requirePack(tx, teamId, packId)
      requireLog(tx, teamId, packId, logId)
      tx.delete(dischargeLogs).where(eq(dischargeLogs.id, logId)).run()
    })
    res.status(204).end()
  })

  router.post('/:logId/accept', requireTeamRole('editor'), (req, res) => {
    const teamId = teamIdOf(req)
    const packId = packIdOf(req)
    const logId = logIdOf(req)
    const body = parseInput(acceptDischargeLogSchema, req.body ?? {})
    const nowMs = clock().getTime()
    const userId = signedInUser(req).user.id
    const answer = db.transaction((tx) => {
      const pack = requirePack(tx, teamId, packId)
      const found = requireLog(tx, teamId, packId, logId)
      const { log } = found
      if (body.version !== undefined && body.version !== pack.version) {
        throw new ApiError(
          409,
          'stale-version',
          `Someone else saved this pack after you opened it: you sent version ${body.version}, the saved one is version ${pack.version}. Nothing was written.`,
        )
      }
      if (!log.analysis.reachedCutoff) {
        throw new ApiError(400, 'log-incomplete', noteFor(log.analysis) ?? logNotFound)
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
      tx.update(packs)
        .set({
          spec: { ...pack.spec, healthPct },
          version: pack.version + 1,
          updatedAtMs: nowMs,
          updatedByUserId: userId,
        })
        .where(and(eq(packs.id, pack.id), eq(packs.version, pack.version)))
        .run()
      tx.update(dischargeLogs)
        .set({ acceptedAtMs: nowMs })
        .where(eq(dischargeLogs.id, log.id))
        .run()
      const updatedRigs = carryPackHealthToRigs(tx, teamId, packId, healthPct, { nowMs, userId })
      return {
        pack: packItemOf(tx, requirePack(tx, teamId, packId)),
        log: detailOf(requireLog(tx, teamId, packId, logId), requirePack(tx, teamId, packId)),
        updatedRigs,
      }
    })
    res.json(answer)
  })

  return router
}
