import { afterEach, beforeEach, describe, expect, it } from 'vitest'
import { eq } from 'drizzle-orm'
import { seedDemo } from '../../server/db/seed'
import { plans } from '../../server/db/schema-resources'
import request from 'supertest'
import { ENGINE_VERSION } from '../../shared/engine'
import { planEstimateRequest } from '../../shared/plans/request'
import { planBody } from '../helpers/plan-fixture'
import { plainRigSpec, teamApi } from '../helpers/resource-fixture'
import { createTeamFixture, type TeamFixture } from '../helpers/team-fixture'
import { createTestApp } from '../helpers/test-app'

// Event plans: /api/v1/teams/:teamId/plans (docs/api.md). Who may call what is in the
// authorization matrix; these check what the routes store and refuse.

let fixture: TeamFixture
let editor: ReturnType<typeof teamApi>
let admin: ReturnType<typeof teamApi>
let rigId: number
beforeEach(async () => {
  fixture = await createTeamFixture()
  const teamId = fixture.placeholders.teamId!
  editor = teamApi(fixture.testApp.app, teamId, fixture.cookies.editor)
  admin = teamApi(fixture.testApp.app, teamId, fixture.cookies.admin)
  rigId = Number(fixture.placeholders.planRigId)
})
afterEach(() => fixture.testApp.close())

/** Loud dense music (crest factor 8 dB, peaks at clipping) around a lunch with the rig off. */
const longDay = {
  ...planBody,
  name: 'Long fair day',
  startTime: '08:00',
  packCount: 2,
  temperatureC: null,
  swapPolicy: { mode: 'when-empty' },
  schedule: [
    { label: 'Morning', minutes: 60, state: 'on', peakBelowClipDb: 0, crestFactorDb: 8 },
    { label: 'Lunch', minutes: 45, state: 'off' },
    { label: 'Afternoon', minutes: 240, state: 'on', peakBelowClipDb: 0, crestFactorDb: 8 },
  ],
}

/** HH:MM after a start, by the calendar arithmetic of Date (not the app's own clock code). */
function wallClock(startTime: string, minutes: number): string {
  const start = new Date(`2026-06-13T${startTime}:00Z`).getTime()
  return new Date(start + Math.floor(minutes) * 60_000).toISOString().slice(11, 16)
}

describe('saving a plan runs the day on the server', () => {
  it('stores the summary of the same engine, with each swap on the event clock', async () => {
    const created = await editor.post('/plans', { ...longDay, rigId }).expect(201)
    // Relation: the stored summary is what the public estimate answers for the day's request.
    const { body: result } = await request(fixture.testApp.app)
      .post('/api/v1/estimate')
      .send(
        planEstimateRequest(plainRigSpec, {
          temperatureC: null,
          packCount: 2,
          swapPolicy: { mode: 'when-empty' },
          schedule: longDay.schedule as never,
        }),
      )
      .expect(200)
    expect(created.body).toMatchObject({
      name: 'Long fair day',
      rigId,
      rigName: 'Sports day column',
      date: '2026-06-13',
      startTime: '08:00',
      temperatureC: null,
      packCount: 2,
      version: 1,
      summary: {
        engineVersion: ENGINE_VERSION,
        runtimeHours: result.runtimeHours,
        // The day needs both packs and lasts on them (the next test: not on one).
        lasts: true,
        packsUsed: 2,
      },
    })
    // The day needs the second pack: one swap, part-way through the afternoon.
    const swaps = created.body.summary.swaps as { atMinute: number; atTime: string }[]
    expect(swaps).toHaveLength(1)
    expect(swaps[0]!.atMinute).toBeGreaterThan(105)
    expect(swaps[0]!.atMinute).toBeLessThan(345)
    // Source: ISO 8601 clock arithmetic (JavaScript Date in UTC); shown down to the minute so
    // the swap is never later than the pack runs out.
    for (const swap of swaps) expect(swap.atTime).toBe(wallClock('08:00', swap.atMinute))
  })

  it('says a day does not last on one pack, and keeps the fields it was given', async () => {
    const created = await editor
      .post('/plans', { ...longDay, rigId, packCount: 1, temperatureC: 5 })
      .expect(201)
    expect(created.body.summary).toMatchObject({ lasts: false, packsUsed: 1, swaps: [] })
    const read = await editor.get(`/plans/${created.body.id}`).expect(200)
    expect(read.body).toMatchObject({ packCount: 1, temperatureC: 5, schedule: longDay.schedule })
  })

  it('swaps at the first break below the threshold under that policy', async () => {
    const created = await editor
      .post('/plans', {
        ...longDay,
        rigId,
        swapPolicy: { mode: 'at-break-below', belowSocPct: 90 },
      })
      .expect(201)
    // The first segment takes the pack below 90 %, so the fresh pack goes in at the lunch break,
    // 60 minutes in: 09:00 on the event clock.
    expect(created.body.summary.swaps).toEqual([{ atMinute: 60, atTime: '09:00' }])
  })

  it('recomputes its plans when the rig is saved with a smaller pack', async () => {
    const created = await editor.post('/plans', { ...longDay, rigId }).expect(201)
    expect(created.body.summary.lasts).toBe(true)
    const rig = await editor.get(`/rigs/${rigId}`).expect(200)
    await editor
      .put(`/rigs/${rigId}`, {
        name: rig.body.name,
        version: rig.body.version,
        // A tenth of the cells' capacity: two packs of it cannot carry the day.
        spec: { ...plainRigSpec, pack: { ...plainRigSpec.pack, cellCapacityAh: 0.25 } },
      })
      .expect(200)
    const after = await editor.get(`/plans/${created.body.id}`).expect(200)
    expect(after.body.version).toBe(1)
    expect(after.body.summary.lasts).toBe(false)
  })

  it('duplicates a plan with its day and a fresh summary', async () => {
    const planId = fixture.placeholders.planId!
    const copy = await editor.post(`/plans/${planId}/duplicate`).expect(201)
    expect(copy.body).toMatchObject({
      name: 'School sports day (copy)',
      schedule: planBody.schedule,
      summary: { lasts: expect.any(Boolean) },
    })
  })
})

describe('bad plans are refused, naming the field, and nothing is written', () => {
  const cases: [string, Record<string, unknown>, string][] = [
    ['an impossible date', { date: '2026-02-30' }, 'date'],
    ['a date in another format', { date: '13/06/2026' }, 'date'],
    ['a start time past 23:59', { startTime: '24:00' }, 'startTime'],
    ['a start time without minutes', { startTime: '8' }, 'startTime'],
    ['no segments', { schedule: [] }, 'schedule'],
    ['a segment of no length', { schedule: [{ label: 'Gap', minutes: 0 }] }, 'schedule.0.minutes'],
    [
      'a segment state that does not exist',
      { schedule: [{ label: 'X', minutes: 5, state: 'paused' }] },
      'schedule.0.state',
    ],
    ['more packs than the limit', { packCount: 51 }, 'packCount'],
    [
      'a swap threshold of 100 %',
      { swapPolicy: { mode: 'at-break-below', belowSocPct: 100 } },
      'swapPolicy.belowSocPct',
    ],
    ['a rig of another team, or none', { rigId: 99_999 }, 'rigId'],
    ['a rig id that is not a number', { rigId: 'one' }, 'rigId'],
  ]
  it.each(cases)('%s', async (_case, change, path) => {
    const before = (await editor.get('/plans').expect(200)).body.total
    const response = await editor.post('/plans', { ...longDay, rigId, ...change }).expect(400)
    expect(response.body.error.code).toBe('invalid-input')
    expect(response.body.error.issues.map((issue: { path: string }) => issue.path)).toContain(path)
    expect((await editor.get('/plans').expect(200)).body.total).toBe(before)
  })

  it('refuses a stale version with 409 and keeps the first save', async () => {
    const planId = fixture.placeholders.planId!
    await editor
      .put(`/plans/${planId}`, { ...planBody, rigId, name: 'First', version: 1 })
      .expect(200)
    const stale = await admin
      .put(`/plans/${planId}`, { ...planBody, rigId, name: 'Second', version: 1 })
      .expect(409)
    expect(stale.body.error.code).toBe('stale-version')
    expect((await editor.get(`/plans/${planId}`).expect(200)).body).toMatchObject({
      name: 'First',
      version: 2,
    })
  })

  it('keeps a rig that a plan uses from being deleted', async () => {
    const response = await editor.delete(`/rigs/${rigId}`).expect(409)
    expect(response.body.error.message).toContain('"School sports day"')
  })
})

describe('the demo plan', () => {
  it('is the Saturday market from 08:00 to 14:00 at 12 °C on the market-stage rig', async () => {
    // Source: invented demo data, README "Demo sign-ins".
    const testApp = createTestApp()
    try {
      await seedDemo(testApp.database, Date.now())
      const plan = testApp.database.db
        .select()
        .from(plans)
        .where(eq(plans.name, 'Saturday market'))
        .get()!
      expect(plan).toMatchObject({ startTime: '08:00', temperatureC: 12 })
      const minutes = plan.schedule.reduce((sum, segment) => sum + segment.minutes, 0)
      expect(minutes).toBe(6 * 60)
      expect(plan.summary?.lasts).toBe(true)
    } finally {
      await testApp.close()
    }
  })
})
