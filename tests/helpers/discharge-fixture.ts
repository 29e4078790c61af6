import type { Queryable } from '../../server/db/queryable'
import { dischargeLogs } from '../../server/db/schema-resources'
import { storedAnalysis } from '../../server/discharge/stored-analysis'
import { constantCurrentSamples } from './discharge-logs'

/**
 * One stored log of 2 A for 2 h down to 30 V on the given pack (a 10S pack cut at 3 V per cell,
 * 5 Ah rated: the resource fixture's), for `:logId` placeholders.
 */
export function seedDischargeLog(
  db: Queryable,
  ids: { teamId: number; packId: number; userId: number },
  nowMs: number,
): { logId: string } {
  const limits = { cutoffV: 30, ratedAh: 5 }
  const samples = constantCurrentSamples({ currentA: 2, hours: 2, startV: 41, endV: 30, stepS: 60 })
  const { id } = db
    .insert(dischargeLogs)
    .values({
      ...ids,
      uploadedByUserId: ids.userId,
      fileName: 'seeded.csv',
      createdAtMs: nowMs,
      ...storedAnalysis(samples, limits),
    })
    .returning({ id: dischargeLogs.id })
    .get()
  return { logId: String(id) }
}
