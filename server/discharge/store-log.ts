import type { AppDatabase } from '../db/client'
import { dischargeLogs } from '../db/schema-resources'
import { ApiError } from '../http/errors'
import type { WriteActor } from '../resources/resource-definition'
import { dischargeLimitsOf } from '../../shared/engine/discharge-model'
import type { DischargeLogDetail } from '../../shared/discharge/log'
import { dischargeLogDetail, requirePack, type PackScope } from './pack-logs'
import { analyseLogOffThread } from './parse-pool'

const fallbackFileName = 'discharge-log.csv'

/** The client's file name, without folders or control characters, at most 200 characters. */
function cleanFileName(raw: string | undefined): string {
  const base = (raw ?? '').split(/[\\/]/).pop() ?? ''
  const cleaned = base.replace(/[\u0000-\u001f\u007f]/g, '').trim()
  return cleaned === '' ? fallbackFileName : cleaned.slice(0, 200)
}

/**
 * Reads an uploaded log against the pack's limits on a parser thread, then stores it with its
 * figures in one transaction. The pack is read again there: if it was edited while the log was
 * read (its cutoff or rated charge changed), the figures were worked out for the old pack and
 * nothing is stored (409). A full parser queue is 503, a bad file 400/415 (parse-pool.ts).
 */
export async function storeDischargeLog(
  db: AppDatabase,
  scope: PackScope,
  file: { bytes: Uint8Array; fileName: string | undefined },
  actor: WriteActor,
): Promise<DischargeLogDetail> {
  const limits = dischargeLimitsOf(requirePack(db, scope).spec)
  const { analysis, points } = await analyseLogOffThread(file.bytes, limits)
  return db.transaction((tx) => {
    const limitsNow = dischargeLimitsOf(requirePack(tx, scope).spec)
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
        ...scope,
        fileName: cleanFileName(file.fileName),
        uploadedByUserId: actor.userId,
        createdAtMs: actor.nowMs,
        analysis,
        points,
      })
      .returning({ id: dischargeLogs.id })
      .get()
    return dischargeLogDetail(tx, scope, id)
  })
}
