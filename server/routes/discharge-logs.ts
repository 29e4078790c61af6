import { Router, type Request } from 'express'
import { requireTeamRole, signedInUser, teamMembership } from '../auth/require'
import { acceptDischargeLog, previewAcceptLog } from '../discharge/accept'
import {
  deleteDischargeLog,
  dischargeLogDetail,
  dischargeLogList,
  logNotFound,
  packNotFound,
  requirePack,
  type PackScope,
} from '../discharge/pack-logs'
import { storeDischargeLog } from '../discharge/store-log'
import { receiveLogFile } from '../discharge/upload'
import { limitConcurrent } from '../http/concurrency'
import { ApiError, parseInput } from '../http/errors'
import { securityEvent } from '../http/log'
import { rowIdParam } from '../http/params'
import type { ResourceContext } from '../resources/resource-definition'
import { DISCHARGE_LOG_FIELD, acceptDischargeLogSchema } from '../../shared/discharge/log'

/*
 * A pack's measured discharges, mounted at `/api/v1/teams/:teamId/packs/:packId/discharge-logs`:
 *
 *   POST   /                        editor  multipart `file` (CSV) → 201 log with its points
 *   GET    /                        viewer  → { items, total }, newest first, without points
 *   GET    /:logId                  viewer  → log with its points
 *   DELETE /:logId                  editor  → 204 (a health figure already accepted stays)
 *   GET    /:logId/accept-preview   viewer  → the effect of accepting: which rigs and plans
 *                                            would take the log's health figure, which not, why
 *   POST   /:logId/accept           editor  { version? } → { pack, log, updatedRigs, effect }
 *
 * The work is the discharge domain's (server/discharge/); this file maps HTTP to it.
 */

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
  const scopeOf = (req: Request): PackScope => ({
    teamId: teamMembership(req).teamId,
    packId: rowIdParam(req, 'packId', packNotFound),
  })
  const logIdOf = (req: Request) => rowIdParam(req, 'logId', logNotFound)
  const actorOf = (req: Request) => ({
    userId: signedInUser(req).user.id,
    nowMs: clock().getTime(),
  })

  router.post(
    '/',
    requireTeamRole('editor'),
    // The pack is looked up before the file is read, so a wrong pack costs no upload.
    (req, _res, next) => {
      requirePack(db, scopeOf(req))
      next()
    },
    uploadSlots,
    receiveLogFile,
    async (req, res) => {
      const scope = scopeOf(req)
      const file = req.file
      if (!file) {
        throw new ApiError(
          400,
          'invalid-upload',
          `Attach the log as a CSV file in the multipart form field "${DISCHARGE_LOG_FIELD}".`,
          [{ path: DISCHARGE_LOG_FIELD, message: 'Choose a CSV file' }],
        )
      }
      const created = await storeDischargeLog(
        db,
        scope,
        { bytes: file.buffer, fileName: file.originalname },
        actorOf(req),
      )
      securityEvent(req, 'discharge-log-uploaded', {
        ...scope,
        logId: created.id,
        bytes: file.size,
      })
      res.status(201).json(created)
    },
  )

  router.get('/', requireTeamRole('viewer'), (req, res) => {
    res.json(dischargeLogList(db, scopeOf(req)))
  })

  router.get('/:logId', requireTeamRole('viewer'), (req, res) => {
    res.json(dischargeLogDetail(db, scopeOf(req), logIdOf(req)))
  })

  router.delete('/:logId', requireTeamRole('editor'), (req, res) => {
    deleteDischargeLog(db, scopeOf(req), logIdOf(req))
    res.status(204).end()
  })

  router.get('/:logId/accept-preview', requireTeamRole('viewer'), (req, res) => {
    res.json(previewAcceptLog(db, scopeOf(req), logIdOf(req)))
  })

  router.post('/:logId/accept', requireTeamRole('editor'), (req, res) => {
    const input = parseInput(acceptDischargeLogSchema, req.body ?? {})
    res.json(acceptDischargeLog(db, scopeOf(req), logIdOf(req), input, actorOf(req)))
  })

  return router
}
