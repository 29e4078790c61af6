import { availableParallelism } from 'node:os'
import { eq } from 'drizzle-orm'
import { afterEach, beforeEach, describe, expect, it } from 'vitest'
import { dischargeLogs, packs } from '../../server/db/schema-resources'
import { storeDischargeLog } from '../../server/discharge/store-log'
import { ApiError } from '../../server/http/errors'
import { constantCurrentSamples, csvOf, plainCells, plainHeader } from '../helpers/discharge-logs'
import { createTeamFixture, type TeamFixture } from '../helpers/team-fixture'

/*
 * Storing an uploaded log, called as the route calls it (the per-account upload limit of the
 * route would stop these before they reached the parser threads). The fixture's pack is 10
 * Li-ion cells in series cut at 3 V per cell: 30 V; 2 × 2.5 Ah = 5 Ah rated.
 */

let fixture: TeamFixture
beforeEach(async () => {
  fixture = await createTeamFixture()
  fixture.testApp.database.db.delete(dischargeLogs).run()
})
afterEach(() => fixture.testApp.close())

const db = () => fixture.testApp.database.db
const scope = () => ({
  teamId: Number(fixture.placeholders.teamId),
  packId: Number(fixture.placeholders.packId),
})
const actor = () => ({ userId: Number(fixture.placeholders.userId), nowMs: Date.now() })

// 2 A for an hour down to the 30 V cutoff: 2 Ah (definition of the ampere-hour).
const log = () => ({
  bytes: Buffer.from(
    csvOf(
      constantCurrentSamples({ currentA: 2, hours: 1, startV: 41, endV: 30, stepS: 60 }),
      plainHeader,
      plainCells,
    ),
  ),
  fileName: '../logs/run\u0007.csv',
})

describe('storing a discharge log', () => {
  it('stores the log with its figures, under a clean file name', async () => {
    const stored = await storeDischargeLog(db(), scope(), log(), actor())
    expect(stored.deliveredAh).toBeCloseTo(2, 9)
    expect(stored.fileName).toBe('run.csv')
    expect(await db().$count(dischargeLogs)).toBe(1)
  })

  it('stores nothing (409) when the pack was edited while its log was read', async () => {
    const storing = storeDischargeLog(db(), scope(), log(), actor())
    // The log is on a parser thread now; meanwhile the cutoff goes from 3.0 to 3.2 V per cell,
    // so the figures (read down to 30 V) are no longer the pack's.
    const pack = db().select().from(packs).where(eq(packs.id, scope().packId)).get()!
    db()
      .update(packs)
      .set({ spec: { ...pack.spec, cutoffCellV: 3.2 } })
      .where(eq(packs.id, pack.id))
      .run()
    const refused = await storing.then(
      () => undefined,
      (error: unknown) => error,
    )
    expect(refused).toBeInstanceOf(ApiError)
    expect(refused).toMatchObject({ status: 409, code: 'pack-changed' })
    expect(await db().$count(dischargeLogs)).toBe(0)
  })

  it('refuses with 503 and Retry-After past what the parser threads can queue, storing what it took', async () => {
    // The parsers take one log a thread (at most one thread fewer than the cores) and queue
    // eight more; ten beyond the cores at once must overflow the queue.
    const attempts = Array.from({ length: availableParallelism() + 10 }, () =>
      storeDischargeLog(db(), scope(), log(), actor()),
    )
    const outcomes = await Promise.allSettled(attempts)
    const refused = outcomes.flatMap((outcome) =>
      outcome.status === 'rejected' ? [outcome.reason as ApiError] : [],
    )
    expect(refused.length).toBeGreaterThan(0)
    for (const error of refused) {
      expect(error).toMatchObject({ status: 503, code: 'parsers-busy' })
      expect(error.headers).toEqual({ 'Retry-After': '30' })
    }
    const stored = outcomes.filter((outcome) => outcome.status === 'fulfilled').length
    expect(stored).toBeGreaterThanOrEqual(8)
    expect(await db().$count(dischargeLogs)).toBe(stored)
  })
})
