import request from 'supertest'
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { eq } from 'drizzle-orm'
import { events } from '../../server/db/schema-events'
import { plans } from '../../server/db/schema-resources'
import { recomputeSummaries } from '../../server/db/recompute-summaries'
import { carryPackHealthToRigs } from '../../server/resources/pack-health'
import { answerFor, eventPlanIds } from '../../server/events/event-plans'
import { ENGINE_VERSION } from '../../shared/engine'
import { estimate } from '../../shared/engine/estimate'
import { eventSummary } from '../../shared/events/run-event'
import type { EventSummary } from '../../shared/schemas/events'
import type { PackHealthEffect } from '../../shared/discharge/health-effect'
import { eventBody } from '../helpers/event-fixture'
import { planBody } from '../helpers/plan-fixture'
import { packBody, plainRigSpec, teamApi } from '../helpers/resource-fixture'
import { createTeamFixture, type TeamFixture } from '../helpers/team-fixture'

// An event's list summary is stored when something it depends on is saved, and the list reads
// it without running the engine. Every engine run goes through `estimate`; it is counted here.
const engine = vi.hoisted(() => ({ failEventRuns: false }))
vi.mock('../../shared/engine/estimate', async (importOriginal) => {
  const actual = await importOriginal<typeof import('../../shared/engine/estimate')>()
  return {
    ...actual,
    estimate: vi.fn((...args: Parameters<typeof actual.estimate>) => {
      // An event runs each plan with as many packs as the schema allows (50): only its runs fail.
      if (engine.failEventRuns && args[0].pack.count === 50) throw new Error('engine failed')
      return actual.estimate(...args)
    }),
  }
})
const engineRuns = vi.mocked(estimate)

let fixture: TeamFixture
let editor: ReturnType<typeof teamApi>
let viewer: ReturnType<typeof teamApi>
let otherAdmin: ReturnType<typeof teamApi>
let eventId: number
let planId: number
let rigId: number
beforeEach(async () => {
  engine.failEventRuns = false
  fixture = await createTeamFixture()
  const teamId = fixture.placeholders.teamId!
  editor = teamApi(fixture.testApp.app, teamId, fixture.cookies.editor)
  viewer = teamApi(fixture.testApp.app, teamId, fixture.cookies.viewer)
  otherAdmin = teamApi(fixture.testApp.app, teamId, fixture.cookies['other-team-admin'])
  eventId = Number(fixture.placeholders.eventId)
  planId = Number(fixture.placeholders.eventPlanId)
  rigId = Number(fixture.placeholders.planRigId)
  engineRuns.mockClear()
})
afterEach(() => fixture.testApp.close())

function storedRow(id = eventId) {
  return fixture.testApp.database.db.select().from(events).where(eq(events.id, id)).get()!
}

/**
 * A summary no engine could give (99 rigs for an event of one plan): when a step stores the
 * summary again, the figures that are facts of the event (its plan count) come back.
 */
function spoilStoredSummary(id = eventId, engineVersion = ENGINE_VERSION): EventSummary {
  const spoiled = { ...storedRow(id).summary!, rigCount: 99, engineVersion }
  fixture.testApp.database.db
    .update(events)
    .set({ summary: spoiled, summaryEngineVersion: engineVersion })
    .where(eq(events.id, id))
    .run()
  return spoiled
}

// The fixture's pack: 10 Li-ion cells in series, 2 in parallel, 2.5 Ah each (a 36 V 5 Ah tool
// pack). A pack kind is named by its build: chemistry/<S>s<P>p/<cell Ah>ah.
const fixtureKind = 'li-ion/10s2p/2.5ah'
// The same tool pack with twice the cells in parallel: a 36 V 10 Ah pack of another kind.
const biggerPack = { ...plainRigSpec.pack, parallelCells: 4, label: 'Tool pack 36 V 10 Ah' }
const biggerKind = 'li-ion/10s4p/2.5ah'

describe('the events list', () => {
  it('answers from the stored summaries and runs the engine not once', async () => {
    const spoiled = spoilStoredSummary()
    engineRuns.mockClear()
    const list = await viewer.get('/events').expect(200)
    expect(engineRuns).not.toHaveBeenCalled()
    const row = list.body.items.find((item: { id: number }) => item.id === eventId)
    expect(row.summary).toEqual(spoiled)
    expect(row.planIds).toEqual([planId])
    expect(row).not.toHaveProperty('answer')
    // One event read on its own still works its answer out from the plans as saved now.
    const one = await viewer.get(`/events/${eventId}`).expect(200)
    expect(engineRuns).toHaveBeenCalled()
    expect(one.body.summary.rigCount).toBe(1)
  })

  it('stores the summary at save: the fixture pack’s kind, the pool on hand, one rig', async () => {
    const created = await editor
      .post('/events', { ...eventBody, planIds: [planId], pool: [{ kind: fixtureKind, count: 4 }] })
      .expect(201)
    const row = storedRow(created.body.id)
    expect(row.summaryEngineVersion).toBe(ENGINE_VERSION)
    expect(row.summary).toMatchObject({
      engineVersion: ENGINE_VERSION,
      rigCount: 1,
      packsToBring: [{ kind: fixtureKind, label: packBody.name, onHand: 4 }],
    })
    // What the save answered is what the list shows.
    expect(row.summary).toEqual(created.body.summary)
  })
})

describe('an event’s summary follows its plans and rigs', () => {
  it('changes when one of its plans is saved on a rig with another pack', async () => {
    const bigger = await editor
      .post('/rigs', {
        name: 'Sports day column, big pack',
        spec: { ...plainRigSpec, pack: biggerPack },
      })
      .expect(201)
    spoilStoredSummary()
    await editor
      .put(`/plans/${planId}`, {
        ...planBody,
        name: 'Sports day, far field',
        rigId: bigger.body.id,
        version: 1,
      })
      .expect(200)
    expect(storedRow().summary).toMatchObject({
      rigCount: 1,
      packsToBring: [{ kind: biggerKind, label: 'Tool pack 36 V 10 Ah' }],
    })
  })

  it('changes when the plan’s rig is saved with another pack (the rig recomputes its plans)', async () => {
    const rig = await editor.get(`/rigs/${rigId}`).expect(200)
    spoilStoredSummary()
    await editor
      .put(`/rigs/${rigId}`, {
        name: rig.body.name,
        spec: { ...rig.body.spec, pack: biggerPack },
        version: rig.body.version,
      })
      .expect(200)
    expect(storedRow().summary).toMatchObject({
      rigCount: 1,
      packsToBring: [{ kind: biggerKind, label: 'Tool pack 36 V 10 Ah' }],
    })
  })

  it('is stored again when a pack’s health figure is carried to the plan’s rig', () => {
    const { db } = fixture.testApp.database
    spoilStoredSummary()
    // The plan fixture's rig was not built from a saved pack; the effect names it as changing.
    const effect: PackHealthEffect = {
      healthPct: 80,
      fromHealthPct: null,
      rigs: {
        changing: [{ id: rigId, name: 'Sports day column', fromHealthPct: null }],
        keeping: [],
      },
      plans: { changing: [], keeping: [] },
    }
    db.transaction((tx) =>
      carryPackHealthToRigs(tx, effect, {
        userId: Number(fixture.placeholders.userId),
        nowMs: Date.now(),
      }),
    )
    const stored = storedRow()
    expect(stored.summary?.rigCount).toBe(1)
    // Refactor-equivalence check (our engine against itself): what is stored is what the event
    // works out from the rig as saved now, with the health figure in it.
    const fresh = eventSummary(
      answerFor(db, stored.teamId, {
        planIds: eventPlanIds(db, eventId),
        pool: stored.pool,
        chargers: stored.chargers,
      }),
    )
    expect(stored.summary).toEqual(fresh)
  })

  it('is never half-written: when the event cannot be worked out, the plan’s save is undone', async () => {
    const before = storedRow()
    const planBefore = fixture.testApp.database.db
      .select()
      .from(plans)
      .where(eq(plans.id, planId))
      .get()!
    engine.failEventRuns = true
    await editor
      .put(`/plans/${planId}`, {
        ...planBody,
        name: 'Renamed',
        rigId,
        startTime: '09:00',
        version: 1,
      })
      .expect(500)
    const planAfter = fixture.testApp.database.db
      .select()
      .from(plans)
      .where(eq(plans.id, planId))
      .get()!
    expect(planAfter).toEqual(planBefore)
    expect(storedRow()).toEqual(before)
  })
})

describe('stored event summaries at start', () => {
  it('works out a missing or older summary again, and then nothing', async () => {
    const second = await editor.post('/events', { ...eventBody, planIds: [planId] }).expect(201)
    // As if saved before the column existed, and by an older engine.
    fixture.testApp.database.db
      .update(events)
      .set({ summary: null, summaryEngineVersion: null })
      .where(eq(events.id, second.body.id))
      .run()
    spoilStoredSummary(eventId, '0.9.0')
    const listed = await viewer.get('/events').expect(200)
    const missing = listed.body.items.find((item: { id: number }) => item.id === second.body.id)
    expect(missing.summary).toBeNull()

    const report = recomputeSummaries(fixture.testApp.database)
    expect(report?.events).toBe(2)
    for (const id of [eventId, second.body.id]) {
      expect(storedRow(id).summaryEngineVersion).toBe(ENGINE_VERSION)
      expect(storedRow(id).summary).toMatchObject({ engineVersion: ENGINE_VERSION, rigCount: 1 })
    }
    expect(recomputeSummaries(fixture.testApp.database)).toBeUndefined()
  })
})

describe('another team', () => {
  it('neither reads the team’s events list nor changes a summary through a plan', async () => {
    const before = storedRow()
    const list = await otherAdmin.get('/events')
    expect([403, 404]).toContain(list.status)
    expect(JSON.stringify(list.body)).not.toContain('Sports day')
    await otherAdmin
      .put(`/plans/${planId}`, { ...planBody, name: 'Taken over', rigId, version: 1 })
      .expect((response) => expect([403, 404]).toContain(response.status))
    expect(storedRow()).toEqual(before)

    // Its own list, under its own team, holds none of ours.
    const me = await request(fixture.testApp.app)
      .get('/api/v1/auth/me')
      .set('Cookie', fixture.cookies['other-team-admin']!)
      .expect(200)
    const own = teamApi(
      fixture.testApp.app,
      String(me.body.teams[0].id),
      fixture.cookies['other-team-admin']!,
    )
    const ownList = await own.get('/events').expect(200)
    expect(ownList.body.items.map((item: { id: number }) => item.id)).not.toContain(eventId)
  })
})
