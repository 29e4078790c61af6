import { createHash } from 'node:crypto'
import request from 'supertest'
import { afterEach, beforeEach, describe, expect, it } from 'vitest'
import { shareLinks } from '../../server/db/schema-resources'
import { demoPassword } from '../../server/db/seed'
import { signInCookie } from '../helpers/accounts'
import { createCardFixture, tokenOf, type CardFixture } from '../helpers/card-fixture'

// Share links to a plan's card (docs/api.md: POST|DELETE .../plans/:planId/share-links
// for editors, GET /api/v1/shared/:token anonymous and read-only, 404 once revoked or expired).

let fixture: CardFixture
beforeEach(async () => {
  fixture = await createCardFixture()
})
afterEach(() => fixture.testApp.close())

const hourMs = 60 * 60 * 1000

function createLink(body: Record<string, unknown> = {}, cookie = fixture.cookies.editor) {
  return request(fixture.testApp.app)
    .post(`${fixture.planPath}/share-links`)
    .set('Cookie', cookie)
    .send(body)
}

/** The shared card, fetched signed out. */
function openSignedOut(token: string) {
  return request(fixture.testApp.app).get(`/api/v1/shared/${token}`)
}

describe('a share link to a plan card', () => {
  it('opens the card signed out, with the swaps of the saved plan and nothing else', async () => {
    const created = await createLink({ label: 'Volunteers' }).expect(201)
    // Source: docs/api.md: PUBLIC_URL + the client page of the link
    expect(created.body.url).toMatch(/^http:\/\/localhost:3999\/shared\/[A-Za-z0-9_-]{43}$/)
    // Source: the Gregorian calendar: the day after Saturday 13 June 2026 (the demo plan's date)
    // has ended in every time zone (UTC−12) at 12:00 UTC on 15 June
    expect(created.body).toMatchObject({
      label: 'Volunteers',
      expiresAt: '2026-06-15T12:00:00.000Z',
    })

    const plan = await request(fixture.testApp.app)
      .get(fixture.planPath)
      .set('Cookie', fixture.cookies.editor)
      .expect(200)
    const shared = await openSignedOut(tokenOf(created.body.url)).expect(200)
    expect(Object.keys(shared.body).sort()).toEqual(['card', 'expiresAt'])
    expect(shared.headers['cache-control']).toBe('no-store')
    const card = shared.body.card
    expect(card.title).toBe('Saturday market')
    // The same swaps as the plan's stored summary, on the same clock.
    expect(card.swaps.map((swap: { atLabel: string }) => swap.atLabel)).toEqual(
      plan.body.summary.swaps.map((swap: { atTime: string }) => swap.atTime),
    )
    // Source: clock arithmetic: the demo day runs 08:00 + 6 h (its six segments add to 360 min)
    expect(card.timeLabel).toBe('08:00 to 14:00')
    // Nothing that names the team, the plan's id or the people behind it.
    const text = JSON.stringify(shared.body)
    expect(text).not.toContain('Alder Creek Market Crew')
    expect(text).not.toContain('Sam Creek')
    expect(text).not.toMatch(/"(id|teamId|planId|rigId)"/)
  })

  it('lasts until revoked when asked to, and a week for a plan whose day is past', async () => {
    const untilRevoked = await createLink({ expiresAt: null }).expect(201)
    expect(untilRevoked.body.expiresAt).toBeNull()
    // Past the day after the event (15 June 12:00 UTC), a new link gets 7 days from now.
    fixture.advanceMs(20 * 24 * hourMs)
    const cookie = await signInCookie(
      fixture.testApp.app,
      'editor@alder-creek.example',
      demoPassword,
    )
    const late = await createLink({}, cookie).expect(201)
    expect(Date.parse(late.body.expiresAt)).toBe(fixture.nowMs() + 7 * 24 * hourMs)
  })

  it('keeps only the SHA-256 of a token of at least 128 bits', async () => {
    const created = await createLink().expect(201)
    const token = tokenOf(created.body.url)
    // Source: OWASP (session and reset tokens ≥ 128 bits of entropy); RFC 4648 §5 base64url
    expect(Buffer.from(token, 'base64url').length * 8).toBeGreaterThanOrEqual(128)
    const rows = fixture.testApp.database.db.select().from(shareLinks).all()
    expect(rows).toHaveLength(1)
    // Source: FIPS 180-4 (SHA-256), computed here with Node's own implementation
    expect(rows[0]!.tokenHash).toBe(createHash('sha256').update(token).digest('hex'))
    expect(JSON.stringify(rows)).not.toContain(token)
    const listed = await request(fixture.testApp.app)
      .get(`${fixture.planPath}/share-links`)
      .set('Cookie', fixture.cookies.viewer)
      .expect(200)
    expect(listed.body.items).toHaveLength(1)
    expect(JSON.stringify(listed.body)).not.toContain(token)
  })

  it('stops working once revoked, and leaves the list', async () => {
    const kept = await createLink({ label: 'Stage crew' }).expect(201)
    const revoked = await createLink({ label: 'Gate' }).expect(201)
    await openSignedOut(tokenOf(revoked.body.url)).expect(200)
    await request(fixture.testApp.app)
      .delete(`${fixture.planPath}/share-links/${revoked.body.id}`)
      .set('Cookie', fixture.cookies.editor)
      .expect(204)
    const gone = await openSignedOut(tokenOf(revoked.body.url)).expect(404)
    expect(gone.body.error.message).toMatch(/revoked, has expired, or was never made/)
    await openSignedOut(tokenOf(kept.body.url)).expect(200)
    const listed = await request(fixture.testApp.app)
      .get(`${fixture.planPath}/share-links`)
      .set('Cookie', fixture.cookies.editor)
      .expect(200)
    expect(listed.body.items.map((link: { label: string }) => link.label)).toEqual(['Stage crew'])
    await request(fixture.testApp.app)
      .delete(`${fixture.planPath}/share-links/${revoked.body.id}`)
      .set('Cookie', fixture.cookies.editor)
      .expect(404)
  })

  it('stops working at its expiry', async () => {
    const expiresAt = new Date(fixture.nowMs() + hourMs).toISOString()
    const created = await createLink({ expiresAt }).expect(201)
    expect(created.body.expiresAt).toBe(expiresAt)
    const token = tokenOf(created.body.url)
    fixture.advanceMs(hourMs - 1000)
    const before = await openSignedOut(token).expect(200)
    expect(before.body.expiresAt).toBe(expiresAt)
    fixture.advanceMs(1000)
    await openSignedOut(token).expect(404)
    const listed = await request(fixture.testApp.app)
      .get(`${fixture.planPath}/share-links`)
      .set('Cookie', fixture.cookies.editor)
      .expect(200)
    expect(listed.body.items).toEqual([])
  })

  it('refuses an expiry in the past, too far ahead or not a time, naming the field', async () => {
    for (const expiresAt of [
      new Date(fixture.nowMs() - 1000).toISOString(),
      new Date(fixture.nowMs() + 400 * 24 * hourMs).toISOString(),
      'next Saturday',
    ]) {
      const refused = await createLink({ expiresAt }).expect(400)
      expect(refused.body.error.issues[0].path).toBe('expiresAt')
    }
    const tooLong = await createLink({ label: 'x'.repeat(81) }).expect(400)
    expect(tooLong.body.error.issues[0].path).toBe('label')
    expect(fixture.testApp.database.db.select().from(shareLinks).all()).toEqual([])
  })

  it('is the editors’: viewers get 403 and other teams 404, for the plan and its links', async () => {
    const refused = await createLink({}, fixture.cookies.viewer).expect(403)
    expect(refused.body.error.code).toBe('role-too-low')
    const created = await createLink().expect(201)
    await createLink({}, fixture.cookies.otherTeamAdmin).expect(404)
    const other = request(fixture.testApp.app)
    await other
      .get(`${fixture.planPath}/share-links`)
      .set('Cookie', fixture.cookies.otherTeamAdmin)
      .expect(404)
    await request(fixture.testApp.app)
      .delete(`${fixture.planPath}/share-links/${created.body.id}`)
      .set('Cookie', fixture.cookies.viewer)
      .expect(403)
    // The other team's admin, through their own team's path, reaches no plan of this one.
    const me = await request(fixture.testApp.app)
      .get('/api/v1/auth/me')
      .set('Cookie', fixture.cookies.otherTeamAdmin)
      .expect(200)
    const harborId = me.body.teams[0].id as number
    await request(fixture.testApp.app)
      .delete(`/api/v1/teams/${harborId}/plans/${fixture.planId}/share-links/${created.body.id}`)
      .set('Cookie', fixture.cookies.otherTeamAdmin)
      .expect(404)
    await request(fixture.testApp.app)
      .post(`/api/v1/teams/${harborId}/plans/${fixture.planId}/share-links`)
      .set('Cookie', fixture.cookies.otherTeamAdmin)
      .send({})
      .expect(404)
    await openSignedOut(tokenOf(created.body.url)).expect(200)
  })

  it('answers the same 404 for a malformed, an unknown and a deleted plan’s token', async () => {
    const created = await createLink().expect(201)
    const malformed = await openSignedOut('not-a-token').expect(404)
    const unknown = await openSignedOut('A'.repeat(43)).expect(404)
    expect(unknown.body).toEqual(malformed.body)
    // The demo event lists the plan, and a plan in an event cannot be deleted: delete the event.
    const teamPath = fixture.planPath.replace(/\/plans\/\d+$/, '')
    const events = await request(fixture.testApp.app)
      .get(`${teamPath}/events`)
      .set('Cookie', fixture.cookies.editor)
      .expect(200)
    for (const event of events.body.items as { id: number }[]) {
      await request(fixture.testApp.app)
        .delete(`${teamPath}/events/${event.id}`)
        .set('Cookie', fixture.cookies.editor)
        .expect(204)
    }
    await request(fixture.testApp.app)
      .delete(fixture.planPath)
      .set('Cookie', fixture.cookies.editor)
      .expect(204)
    const deleted = await openSignedOut(tokenOf(created.body.url)).expect(404)
    expect(deleted.body).toEqual(malformed.body)
  })

  it('throttles one address after 60 card requests a minute', async () => {
    // Ours: the limit set in server/routes/shared.ts
    for (let index = 0; index < 60; index++) await openSignedOut('B'.repeat(43)).expect(404)
    const throttled = await openSignedOut('B'.repeat(43)).expect(429)
    expect(throttled.body.error.code).toBe('throttled')
    expect(Number(throttled.headers['retry-after'])).toBeGreaterThan(0)
  })
})
