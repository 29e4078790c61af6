import request from 'supertest'
import { afterEach, beforeEach, describe, expect, it } from 'vitest'
import { eq } from 'drizzle-orm'
import { shareLinks } from '../../server/db/schema-resources'
import { users } from '../../server/db/schema'
import { planBody } from '../helpers/plan-fixture'
import { createCardFixture, tokenOf, type CardFixture } from '../helpers/card-fixture'

// E-mailing a plan's card to the crew (docs/api.md: POST .../plans/:planId/card-emails
// `{ to: [email] }`, editors): each address gets the card inline as HTML, a text part, and a
// read-only share link, through the mail service (here its built-in catcher).

let fixture: CardFixture
beforeEach(async () => {
  fixture = await createCardFixture()
})
afterEach(() => fixture.testApp.close())

interface OutboxMessage {
  to: string
  subject: string
  text: string
  html: string
}

async function outbox(): Promise<OutboxMessage[]> {
  const answer = await request(fixture.testApp.app)
    .get('/api/v1/dev/outbox')
    .set('Cookie', fixture.cookies.admin)
    .expect(200)
  return answer.body.messages
}

function sendCard(body: unknown, cookie = fixture.cookies.editor, planPath = fixture.planPath) {
  return request(fixture.testApp.app)
    .post(`${planPath}/card-emails`)
    .set('Cookie', cookie)
    .send(body as object)
}

describe('e-mailing the card', () => {
  it('lands in the outbox for each address, as HTML and text, with a link that opens signed out', async () => {
    const to = ['gate@volunteers.example', 'stage@volunteers.example']
    const sent = await sendCard({ to }).expect(201)
    expect(sent.body.sent).toEqual(to)
    const url: string = sent.body.shareLink.url
    expect(url).toMatch(/^http:\/\/localhost:3999\/shared\/[A-Za-z0-9_-]{43}$/)
    // Without an expiry, the link lasts through the day after the plan's date (13 June 2026).
    expect(sent.body.shareLink.expiresAt).toBe('2026-06-15T12:00:00.000Z')

    const messages = await outbox()
    expect(messages.map((message) => message.to).sort()).toEqual(to)
    const plan = await request(fixture.testApp.app)
      .get(fixture.planPath)
      .set('Cookie', fixture.cookies.editor)
      .expect(200)
    const swapTimes: string[] = plan.body.summary.swaps.map(
      (swap: { atTime: string }) => swap.atTime,
    )
    expect(swapTimes.length).toBeGreaterThan(0)
    for (const message of messages) {
      // Source: the Gregorian calendar: 13 June 2026 is a Saturday. The plan's name stays out of
      // the subject (what an editor typed could pose as anything there).
      expect(message.subject).toBe('Loudhour runtime card, Saturday 13 June 2026')
      expect(message.html).toContain(`href="${url}"`)
      expect(message.text).toContain(url)
      for (const time of swapTimes) {
        expect(message.html).toContain(time)
        expect(message.text).toContain(time)
      }
      expect(message.text).toContain('SWAP TIMES')
      expect(message.text).toContain('Sam Creek (editor) sent you the runtime card')
      // Source: the Gregorian calendar: the day after Saturday 13 June 2026 is Sunday the 14th,
      // and it has ended everywhere (UTC−12) at 12:00 UTC on Monday 15 June
      expect(message.text).toContain('Its link works until Monday 15 June 2026, 12:00 UTC.')
      expect(message.html).toMatch(/Lithium packs/)
      expect(message.html).toMatch(/follow local codes and licensed practice/)
    }

    const shared = await request(fixture.testApp.app)
      .get(`/api/v1/shared/${tokenOf(url)}`)
      .expect(200)
    expect(shared.body.card.title).toBe('Saturday market')
    const listed = await request(fixture.testApp.app)
      .get(`${fixture.planPath}/share-links`)
      .set('Cookie', fixture.cookies.editor)
      .expect(200)
    expect(listed.body.items.map((link: { label: string }) => link.label)).toEqual([
      'E-mailed to gate@volunteers.example, stage@volunteers.example',
    ])
  })

  it('escapes what people typed in the HTML part', async () => {
    const created = await request(fixture.testApp.app)
      .post(`/api/v1/teams/${fixture.teamId}/plans`)
      .set('Cookie', fixture.cookies.editor)
      .send({
        ...planBody,
        name: '<b>Fish & Chips</b> fair',
        notes: '<script>alert(1)</script>',
        rigId: (
          await request(fixture.testApp.app)
            .get(fixture.planPath)
            .set('Cookie', fixture.cookies.editor)
            .expect(200)
        ).body.rigId,
      })
      .expect(201)
    const planPath = `/api/v1/teams/${fixture.teamId}/plans/${created.body.id}`
    await sendCard({ to: ['crew@volunteers.example'] }, fixture.cookies.editor, planPath).expect(
      201,
    )
    const [message] = await outbox()
    expect(message!.html).toContain('&lt;b&gt;Fish &amp; Chips&lt;/b&gt; fair')
    expect(message!.html).toContain('&lt;script&gt;alert(1)&lt;/script&gt;')
    expect(message!.html).not.toContain('<b>Fish')
    expect(message!.html).not.toContain('<script>')
    expect(message!.text).toContain('<b>Fish & Chips</b> fair')
  })

  it('refuses bad lists naming the field, and then sends nothing and makes no link', async () => {
    const many = Array.from({ length: 21 }, (_, index) => `crew${index}@volunteers.example`)
    const cases: [unknown, string][] = [
      [{ to: [] }, 'to'],
      [{ to: many }, 'to'],
      [{ to: ['a@volunteers.example', 'A@volunteers.example'] }, 'to'],
      [{ to: ['a@volunteers.example', 'not an address'] }, 'to.1'],
      [{}, 'to'],
    ]
    for (const [body, path] of cases) {
      const refused = await sendCard(body).expect(400)
      expect(refused.body.error.issues[0].path).toBe(path)
    }
    expect(await outbox()).toEqual([])
    expect(fixture.testApp.database.db.select().from(shareLinks).all()).toEqual([])
  })

  it('is for confirmed addresses: an unconfirmed editor gets 403 and nothing is sent', async () => {
    fixture.testApp.database.db
      .update(users)
      .set({ emailVerifiedAtMs: null })
      .where(eq(users.email, 'editor@alder-creek.example'))
      .run()
    const refused = await sendCard({ to: ['crew@volunteers.example'] }).expect(403)
    expect(refused.body.error.code).toBe('email-unverified')
    expect(await outbox()).toEqual([])
    expect(fixture.testApp.database.db.select().from(shareLinks).all()).toEqual([])
  })

  it("counts each address against the team's daily cap, and a refused sending leaves no link", async () => {
    await fixture.testApp.close()
    fixture = await createCardFixture({ TEAM_MAIL_DAILY_LIMIT: '3' })
    await sendCard({ to: ['a@volunteers.example', 'b@volunteers.example'] }).expect(201)
    const capped = await sendCard({
      to: ['c@volunteers.example', 'd@volunteers.example'],
    }).expect(429)
    expect(capped.body.error.code).toBe('team-mail-cap')
    // Nothing has aged yet: room comes when the first two are a day old (RFC 9110 §10.2.3, seconds).
    expect(capped.headers['retry-after']).toBe(String(24 * 60 * 60))
    expect(fixture.testApp.database.db.select().from(shareLinks).all()).toHaveLength(1)
    await sendCard({ to: ['c@volunteers.example'] }).expect(201)
  })

  it('is for editors: viewers get 403, other teams 404, and nothing is sent', async () => {
    await sendCard({ to: ['crew@volunteers.example'] }, fixture.cookies.viewer).expect(403)
    await sendCard({ to: ['crew@volunteers.example'] }, fixture.cookies.otherTeamAdmin).expect(404)
    expect(await outbox()).toEqual([])
  })
})
