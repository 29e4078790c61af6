import request from 'supertest'
import { afterEach, describe, expect, it } from 'vitest'
import { invitations } from '../../server/db/schema'
import { fakeClock, signInCookie, signUp, tokenInMail, type SignedUp } from '../helpers/accounts'
import { createTestApp, type TestApp } from '../helpers/test-app'

let testApp: TestApp | undefined
afterEach(async () => {
  await testApp?.close()
  testApp = undefined
})

interface Crew {
  testApp: TestApp
  admin: SignedUp
  teamId: number
}

/** An admin with a team named "Crew" (besides their personal team). */
async function crew(clock?: () => Date): Promise<Crew> {
  testApp = createTestApp({}, { clock })
  const admin = await signUp(testApp, 'admin@crew.example', 'Ada Admin')
  const created = await request(testApp.app)
    .post('/api/v1/teams')
    .set('Cookie', admin.cookie)
    .send({ name: 'Crew' })
    .expect(201)
  return { testApp, admin, teamId: created.body.team.id as number }
}

async function invite(c: Crew, email: string, role: string): Promise<string> {
  await request(c.testApp.app)
    .post(`/api/v1/teams/${c.teamId}/invitations`)
    .set('Cookie', c.admin.cookie)
    .send({ email, role })
    .expect(201)
  const outbox = await request(c.testApp.app)
    .get('/api/v1/dev/outbox')
    .set('Cookie', c.admin.cookie)
    .expect(200)
  const message = outbox.body.messages.find((candidate: { to: string }) => candidate.to === email)
  expect(message.text).toContain('http://localhost:3999/invitations/accept?token=')
  return tokenInMail(message.text)
}

const accept = (c: Crew, cookie: string, token: string) =>
  request(c.testApp.app).post('/api/v1/invitations/accept').set('Cookie', cookie).send({ token })

describe('invitations', () => {
  it('brings the invited address into the team once, with the invited role', async () => {
    const c = await crew()
    const token = await invite(c, 'sam@crew.example', 'editor')
    const preview = await request(c.testApp.app)
      .post('/api/v1/invitations/preview')
      .send({ token })
      .expect(200)
    expect(preview.body.invitation).toMatchObject({
      teamName: 'Crew',
      email: 'sam@crew.example',
      role: 'editor',
    })

    const stranger = await signUp(c.testApp, 'stranger@crew.example')
    const refused = await accept(c, stranger.cookie, token).expect(403)
    expect(refused.body.error.code).toBe('wrong-account')

    const sam = await signUp(c.testApp, 'sam@crew.example', 'Sam')
    const accepted = await accept(c, sam.cookie, token).expect(200)
    expect(accepted.body.team).toEqual({ id: c.teamId, name: 'Crew', role: 'editor' })
    const members = await request(c.testApp.app)
      .get(`/api/v1/teams/${c.teamId}/members`)
      .set('Cookie', sam.cookie)
    expect(
      members.body.members.map((member: { email: string; role: string }) => [
        member.email,
        member.role,
      ]),
    ).toEqual([
      ['admin@crew.example', 'admin'],
      ['sam@crew.example', 'editor'],
    ])
    // Source: our account rules (invitation tokens are single use).
    const again = await accept(c, sam.cookie, token).expect(400)
    expect(again.body.error.issues[0].path).toBe('token')
    const pending = await request(c.testApp.app)
      .get(`/api/v1/teams/${c.teamId}/invitations`)
      .set('Cookie', c.admin.cookie)
    expect(pending.body.invitations).toEqual([])
  })

  it('stores only a hash of the token, and expires it after 7 days', async () => {
    const time = fakeClock()
    const c = await crew(time.clock)
    const token = await invite(c, 'sam@crew.example', 'viewer')
    const stored = c.testApp.database.db.select().from(invitations).all()
    expect(stored).toHaveLength(1)
    expect(JSON.stringify(stored)).not.toContain(token)
    // Source: our account rules (7-day expiry); 256-bit tokens are 43 base64url characters (RFC 4648 §5).
    expect(token).toHaveLength(43)
    await signUp(c.testApp, 'sam@crew.example')
    const preview = () => request(c.testApp.app).post('/api/v1/invitations/preview').send({ token })
    time.advance(7 * 24 * 60 * 60 * 1000 - 60_000)
    await preview().expect(200)
    time.advance(60_000)
    await preview().expect(400)
    // A fresh sign-in, since a week idle also ended Sam's first session.
    await accept(c, await signInCookie(c.testApp.app, 'sam@crew.example'), token).expect(400)
  })

  it('refuses to invite a member, and names the field of a bad address', async () => {
    const c = await crew()
    const duplicate = await request(c.testApp.app)
      .post(`/api/v1/teams/${c.teamId}/invitations`)
      .set('Cookie', c.admin.cookie)
      .send({ email: 'admin@crew.example', role: 'viewer' })
      .expect(409)
    expect(duplicate.body.error.issues[0].path).toBe('email')
    const bad = await request(c.testApp.app)
      .post(`/api/v1/teams/${c.teamId}/invitations`)
      .set('Cookie', c.admin.cookie)
      .send({ email: 'not an address', role: 'owner' })
      .expect(400)
    expect(bad.body.error.issues.map((issue: { path: string }) => issue.path).sort()).toEqual([
      'email',
      'role',
    ])
  })

  it('saves nothing when the invitation cannot be mailed', async () => {
    // Port 9 (discard) on loopback has no SMTP server here, so the connection is refused.
    testApp = createTestApp({ SMTP_URL: 'smtp://127.0.0.1:9' })
    const admin = await signUp(testApp, 'admin@crew.example')
    const teamId = admin.me.teams[0]?.id
    const failed = await request(testApp.app)
      .post(`/api/v1/teams/${teamId}/invitations`)
      .set('Cookie', admin.cookie)
      .send({ email: 'sam@crew.example', role: 'viewer' })
      .expect(502)
    expect(failed.body.error.code).toBe('mail-failed')
    expect(testApp.database.db.select().from(invitations).all()).toEqual([])
  })

  it('throttles one account after 30 invitations an hour, with 429 and Retry-After', async () => {
    // Ours (routes/teams.ts): a crew at once, not a mailing list; counted per inviting account.
    const c = await crew()
    const send = (index: number) =>
      request(c.testApp.app)
        .post(`/api/v1/teams/${c.teamId}/invitations`)
        .set('Cookie', c.admin.cookie)
        .send({ email: `crew${index}@crew.example`, role: 'viewer' })
    for (let index = 0; index < 30; index++) await send(index).expect(201)
    const refused = await send(30).expect(429)
    expect(refused.body.error.code).toBe('throttled')
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0)
    expect(testApp!.database.db.select().from(invitations).all()).toHaveLength(30)
  })
})

describe('roles and the last admin', () => {
  it('applies a role change to the very next request (roles are not in the token)', async () => {
    const c = await crew()
    const token = await invite(c, 'sam@crew.example', 'admin')
    const sam = await signUp(c.testApp, 'sam@crew.example')
    await accept(c, sam.cookie, token).expect(200)
    const samId = sam.me.user.id
    await request(c.testApp.app)
      .get(`/api/v1/teams/${c.teamId}/invitations`)
      .set('Cookie', sam.cookie)
      .expect(200)
    await request(c.testApp.app)
      .patch(`/api/v1/teams/${c.teamId}/members/${samId}`)
      .set('Cookie', c.admin.cookie)
      .send({ role: 'viewer' })
      .expect(200)
    await request(c.testApp.app)
      .get(`/api/v1/teams/${c.teamId}/invitations`)
      .set('Cookie', sam.cookie)
      .expect(403)
    await request(c.testApp.app)
      .delete(`/api/v1/teams/${c.teamId}/members/${samId}`)
      .set('Cookie', c.admin.cookie)
      .expect(204)
    await request(c.testApp.app)
      .get(`/api/v1/teams/${c.teamId}`)
      .set('Cookie', sam.cookie)
      .expect(404)
  })

  it('keeps the only admin from leaving or being demoted until there is another', async () => {
    const c = await crew()
    const adminId = c.admin.me.user.id
    const demote = () =>
      request(c.testApp.app)
        .patch(`/api/v1/teams/${c.teamId}/members/${adminId}`)
        .set('Cookie', c.admin.cookie)
        .send({ role: 'editor' })
    // Source: our account rules ("the last admin cannot leave or be demoted").
    expect((await demote().expect(409)).body.error.code).toBe('last-admin')
    await request(c.testApp.app)
      .delete(`/api/v1/teams/${c.teamId}/members/${adminId}`)
      .set('Cookie', c.admin.cookie)
      .expect(409)
    const token = await invite(c, 'sam@crew.example', 'viewer')
    const sam = await signUp(c.testApp, 'sam@crew.example')
    await accept(c, sam.cookie, token).expect(200)
    await request(c.testApp.app)
      .patch(`/api/v1/teams/${c.teamId}/members/${sam.me.user.id}`)
      .set('Cookie', c.admin.cookie)
      .send({ role: 'admin' })
      .expect(200)
    await demote().expect(200)
    // A member may leave on their own.
    await request(c.testApp.app)
      .delete(`/api/v1/teams/${c.teamId}/members/${adminId}`)
      .set('Cookie', c.admin.cookie)
      .expect(204)
  })

  it('validates team names and answers 404 for ids that are not teams', async () => {
    const c = await crew()
    const blank = await request(c.testApp.app)
      .post('/api/v1/teams')
      .set('Cookie', c.admin.cookie)
      .send({ name: '   ' })
      .expect(400)
    expect(blank.body.error.issues).toEqual([{ path: 'name', message: 'Enter a team name' }])
    for (const id of ['abc', '0', '999999', '1.5']) {
      await request(c.testApp.app)
        .get(`/api/v1/teams/${id}`)
        .set('Cookie', c.admin.cookie)
        .expect(404)
    }
  })
})
