import request from 'supertest'
import { afterEach, beforeEach, describe, expect, it } from 'vitest'
import { count, eq } from 'drizzle-orm'
import { eventPlans, events } from '../../server/db/schema-events'
import { ENGINE_VERSION } from '../../shared/engine'
import { packKindKey } from '../../shared/events/pack-kinds'
import { eventBody } from '../helpers/event-fixture'
import { planBody } from '../helpers/plan-fixture'
import { plainRigSpec, teamApi } from '../helpers/resource-fixture'
import { createTeamFixture, type TeamFixture } from '../helpers/team-fixture'
import { createTestApp } from '../helpers/test-app'
import { signInCookie } from '../helpers/accounts'
import { demoPassword, seedDemo } from '../../server/db/seed'

// Events: /api/v1/teams/:teamId/events, their preview and share links. Who may call what is in
// the authorization matrix; these check what the routes store, answer and refuse.

let fixture: TeamFixture
let editor: ReturnType<typeof teamApi>
let viewer: ReturnType<typeof teamApi>
let otherAdmin: ReturnType<typeof teamApi>
let planId: number
let eventId: number
beforeEach(async () => {
  fixture = await createTeamFixture()
  const teamId = fixture.placeholders.teamId!
  editor = teamApi(fixture.testApp.app, teamId, fixture.cookies.editor)
  viewer = teamApi(fixture.testApp.app, teamId, fixture.cookies.viewer)
  otherAdmin = teamApi(fixture.testApp.app, teamId, fixture.cookies['other-team-admin'])
  planId = Number(fixture.placeholders.eventPlanId)
  eventId = Number(fixture.placeholders.eventId)
})
afterEach(() => fixture.testApp.close())

const kind = packKindKey(plainRigSpec.pack as never)
const withCharger = {
  ...eventBody,
  name: 'Sports day with the hall socket',
  pool: [{ kind, count: 3 }],
  chargers: [{ label: 'Hall socket', powerW: 60, slots: 1, packKinds: [kind] }],
}

function issuePaths(response: request.Response): string[] {
  return response.body.error.issues.map((issue: { path: string }) => issue.path)
}

describe('saving an event', () => {
  it('stores the plans in order and answers for the whole day', async () => {
    const created = await editor.post('/events', { ...withCharger, planIds: [planId] }).expect(201)
    expect(created.body).toMatchObject({
      name: 'Sports day with the hall socket',
      date: '2026-06-13',
      planIds: [planId],
      pool: [{ kind, count: 3 }],
      version: 1,
      summary: { engineVersion: ENGINE_VERSION, rigCount: 1 },
    })
    const rig = created.body.answer.rigs[0]
    expect(rig.planId).toBe(planId)
    // The plan fixture starts at 08:00: minute 480 on the event clock.
    expect(rig.startMinute).toBe(480)
    expect(created.body.answer.kinds[0]).toMatchObject({ key: kind, onHand: 3 })
    const fetched = await viewer.get(`/events/${created.body.id}`).expect(200)
    expect(fetched.body.answer).toEqual(created.body.answer)
  })

  it('refuses a plan id this team does not have with a 400 naming the field, and writes nothing', async () => {
    const db = fixture.testApp.database.db
    const before = db.select({ n: count() }).from(events).get()!.n
    const otherTeamPlan = planId + 10_000
    const response = await editor
      .post('/events', { ...eventBody, planIds: [planId, otherTeamPlan] })
      .expect(400)
    expect(issuePaths(response)).toEqual(['planIds.1'])
    expect(db.select({ n: count() }).from(events).get()!.n).toBe(before)
  })

  it('names each bad field: a charger with no power, a repeated plan, a date that does not exist', async () => {
    const response = await editor
      .post('/events', {
        ...withCharger,
        date: '2026-02-30',
        planIds: [planId, planId],
        chargers: [{ ...withCharger.chargers[0], powerW: 0 }],
      })
      .expect(400)
    expect(issuePaths(response)).toEqual(
      expect.arrayContaining(['date', 'planIds', 'chargers.0.powerW']),
    )
  })

  it('refuses a stale version with 409 and keeps the newer save', async () => {
    const body = { ...eventBody, planIds: [planId] }
    await editor.put(`/events/${eventId}`, { ...body, name: 'First', version: 1 }).expect(200)
    const stale = await editor
      .put(`/events/${eventId}`, { ...body, name: 'Second', version: 1 })
      .expect(409)
    expect(stale.body.error.code).toBe('stale-version')
    expect((await viewer.get(`/events/${eventId}`)).body).toMatchObject({
      name: 'First',
      version: 2,
    })
  })

  it('answers 404 to another team and 403 to a viewer who writes', async () => {
    await otherAdmin.get(`/events/${eventId}`).expect(404)
    await viewer.post('/events', { ...eventBody, planIds: [planId] }).expect(403)
    await viewer.delete(`/events/${eventId}`).expect(403)
  })

  it('previews an answer without writing anything', async () => {
    const db = fixture.testApp.database.db
    const before = db.select({ n: count() }).from(events).get()!.n
    const preview = await viewer
      .post('/events/preview', { planIds: [planId], pool: [{ kind, count: 1 }], chargers: [] })
      .expect(200)
    expect(preview.body.kinds[0]).toMatchObject({ key: kind, onHand: 1 })
    expect(db.select({ n: count() }).from(events).get()!.n).toBe(before)
  })
})

describe('a plan in an event', () => {
  it('cannot be deleted: 409 names the event, and the event keeps it', async () => {
    const response = await editor.delete(`/plans/${planId}`).expect(409)
    expect(response.body.error.code).toBe('plan-in-event')
    expect(response.body.error.message).toContain('Sports day, both fields')
    const links = fixture.testApp.database.db
      .select()
      .from(eventPlans)
      .where(eq(eventPlans.planId, planId))
      .all()
    expect(links).toHaveLength(1)
  })

  it('can be deleted once the event no longer lists it', async () => {
    const other = await editor
      .post('/plans', {
        ...planBody,
        name: 'Other field',
        rigId: Number(fixture.placeholders.planRigId),
      })
      .expect(201)
    await editor
      .put(`/events/${eventId}`, { ...eventBody, planIds: [other.body.id], version: 1 })
      .expect(200)
    await editor.delete(`/plans/${planId}`).expect(204)
  })
})

describe('an event share link', () => {
  it('shows the card to anyone without ids, and stops when revoked', async () => {
    const created = await editor.post(`/events/${eventId}/share-links`, {}).expect(201)
    const path = new URL(created.body.url).pathname.replace('/shared/events/', '')
    const shared = await request(fixture.testApp.app)
      .get(`/api/v1/shared/events/${path}`)
      .expect(200)
    expect(shared.body.card.title).toBe('Sports day, both fields')
    expect(shared.body.card.answer.rigs[0]).not.toHaveProperty('planId')
    expect(JSON.stringify(shared.body)).not.toContain('"teamId"')
    await editor.delete(`/events/${eventId}/share-links/${created.body.id}`).expect(204)
    await request(fixture.testApp.app).get(`/api/v1/shared/events/${path}`).expect(404)
  })

  it('is not revoked through another event of the team', async () => {
    const other = await editor.post('/events', { ...eventBody, planIds: [planId] }).expect(201)
    await editor
      .delete(`/events/${other.body.id}/share-links/${fixture.placeholders.eventLinkId}`)
      .expect(404)
  })
})

describe('the demo event', () => {
  it('is the market crew’s Saturday: three rigs from 08:00 to 14:00, for the crew only', async () => {
    const testApp = createTestApp()
    try {
      await seedDemo(testApp.database, Date.now())
      const viewer = await signInCookie(testApp.app, 'viewer@alder-creek.example', demoPassword)
      const me = await request(testApp.app).get('/api/v1/auth/me').set('Cookie', viewer)
      const alder = teamApi(testApp.app, String(me.body.teams[0].id), viewer)
      const list = await alder.get('/events').expect(200)
      expect(list.body.total).toBe(1)
      // Source: the product's demo scenario (a market-stage column rig, a busker cart on a 12 V
      // lead-acid battery and a wireless-mic announcer box; Saturday 08:00–14:00 at 12 °C).
      // The list row holds the summary stored by the seed's save, and no answer.
      expect(list.body.items[0].summary.rigCount).toBe(3)
      expect(list.body.items[0]).not.toHaveProperty('answer')
      const event = (await alder.get(`/events/${list.body.items[0].id}`).expect(200)).body
      expect(event.answer.rigs.map((rig: { rigName: string }) => rig.rigName)).toEqual([
        'Market stage columns',
        'Busker cart',
        'Announcer box',
      ])
      expect(event.answer.startMinute).toBe(8 * 60)
      expect(event.answer.endMinute).toBe(14 * 60)
      expect(event.answer.coldestC).toBe(12)
      // The cart's 12 V lead-acid battery is the one kind that is not lithium.
      expect(
        event.answer.kinds
          .filter((kind: { isLithium: boolean }) => !kind.isLithium)
          .map((kind: { label: string }) => kind.label),
      ).toEqual(['Cart battery, 12 V 18 Ah AGM'])
      const harbor = await signInCookie(testApp.app, 'admin@harbor-lane.example', demoPassword)
      await request(testApp.app)
        .get(`/api/v1/teams/${me.body.teams[0].id}/events/${event.id}`)
        .set('Cookie', harbor)
        .expect(404)
    } finally {
      await testApp.close()
    }
  })
})

describe('reading events', () => {
  it('limits one account to 300 reads a minute, list and single reads alike', async () => {
    // Ours (see server/routes/events.ts): 300 a minute, then 429 with Retry-After (RFC 6585 §4).
    for (let read = 0; read < 300; read++) await viewer.get(`/events/${eventId}`).expect(200)
    const refused = await viewer.get('/events').expect(429)
    expect(refused.body.error.code).toBe('throttled')
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0)
    // Another account of the team still reads.
    await editor.get('/events').expect(200)
  })
})
