import request from 'supertest'
import { afterEach, describe, expect, it } from 'vitest'
import { otherStrongPassword, strongPassword } from '../helpers/accounts'
import { captureLog, type LogCapture, type LogLine } from '../helpers/log-capture'
import { createTeamFixture, type TeamFixture } from '../helpers/team-fixture'
import { constantCurrentSamples, csvOf, plainCells, plainHeader } from '../helpers/discharge-logs'

/*
 * The operator's log (README, configuration): one line per API request and a line per security
 * event, each with the client address and the account; never a password, token, cookie or body.
 * What to log and what never to log: OWASP Logging Cheat Sheet ("Which events to log", "Data to
 * exclude"). Addresses come from X-Forwarded-For through TRUST_PROXY=loopback.
 */

let fixture: TeamFixture | undefined
afterEach(async () => {
  await fixture?.testApp.close()
  fixture = undefined
})

async function start(): Promise<{ fixture: TeamFixture; log: LogCapture }> {
  const log = captureLog()
  fixture = await createTeamFixture({ TRUST_PROXY: 'loopback' }, { logger: log.logger })
  return { fixture, log }
}

const newPassword = 'violet harbour climbs early 58'

/** The account a logged sign-up made (the one that was not there before). */
function newSignUpId(signUps: LogLine[]): unknown {
  return signUps.find((entry) => entry.accountCreated === true)?.accountId
}

/** The account id behind a cookie, from the API itself. */
async function idOf(app: TeamFixture, cookie: string): Promise<number> {
  const me = await request(app.testApp.app).get('/api/v1/auth/me').set('Cookie', cookie)
  return me.body.user.id as number
}

describe('the security log', { timeout: 60_000 }, () => {
  it('logs each request with its address and account, and nothing from headers or body', async () => {
    const { fixture, log } = await start()
    const { app } = fixture.testApp
    const { teamId } = fixture.placeholders
    const viewerId = await idOf(fixture, fixture.cookies.viewer)
    await request(app)
      .get(`/api/v1/teams/${teamId}/members?q=secret-search`)
      .set('Cookie', fixture.cookies.viewer)
      .set('X-Forwarded-For', '203.0.113.10')
      .expect(200)
    const line = log
      .lines()
      .find((entry) => (entry.req as { path?: string } | undefined)?.path?.endsWith('/members'))
    expect(line).toMatchObject({
      level: 30,
      ip: '203.0.113.10',
      accountId: viewerId,
      req: { method: 'GET', path: `/api/v1/teams/${teamId}/members` },
      res: { status: 200 },
    })
    expect(line?.responseTime).toEqual(expect.any(Number))
    // Each field once: a duplicated key would leave readers to guess which one counts.
    const raw = log
      .text()
      .split('\n')
      .find((text) => text.includes('/members"'))
    expect(raw?.match(/"ip":/g)).toHaveLength(1)
    // The query string (search text) and the session cookie stay out.
    expect(log.text()).not.toContain('secret-search')
    expect(log.text()).not.toContain(fixture.cookies.viewer.split('=')[1]!)
  })

  it('logs sign-in failures, 401, 403 and 429 with address and account', async () => {
    const { fixture, log } = await start()
    const { app } = fixture.testApp
    const { teamId, userId: targetId } = fixture.placeholders
    const viewerId = await idOf(fixture, fixture.cookies.viewer)
    const signIn = (password: string) =>
      request(app)
        .post('/api/v1/auth/sign-in')
        .set('X-Forwarded-For', '198.51.100.23')
        .send({ email: fixture.emails.target, password })
    for (let attempt = 0; attempt < 10; attempt += 1) await signIn(otherStrongPassword).expect(401)
    await signIn(strongPassword).expect(429)
    await request(app).get('/api/v1/auth/me').set('X-Forwarded-For', '192.0.2.5').expect(401)
    await request(app)
      .patch(`/api/v1/teams/${teamId}/members/${targetId}`)
      .set('Cookie', fixture.cookies.viewer)
      .set('X-Forwarded-For', '192.0.2.6')
      .send({ role: 'admin' })
      .expect(403)

    const failures = log.events('sign-in-failed')
    expect(failures).toHaveLength(10)
    expect(failures[0]).toMatchObject({
      level: 40,
      ip: '198.51.100.23',
      accountId: Number(targetId),
    })
    const refusals = log.events('request-refused')
    expect(
      refusals.filter((entry) => entry.status === 401 && entry.code === 'wrong-credentials'),
    ).toHaveLength(10)
    expect(refusals).toContainEqual(
      expect.objectContaining({ status: 429, code: 'throttled', ip: '198.51.100.23' }),
    )
    expect(refusals).toContainEqual(
      expect.objectContaining({ status: 401, code: 'signed-out', ip: '192.0.2.5' }),
    )
    expect(refusals).toContainEqual(
      expect.objectContaining({
        status: 403,
        code: 'role-too-low',
        ip: '192.0.2.6',
        accountId: viewerId,
      }),
    )
    expect(log.text()).not.toContain(otherStrongPassword)
    expect(log.text()).not.toContain(strongPassword)
    expect(log.text()).not.toContain(fixture.emails.target)
  })

  it('logs resets, role changes, invitations and uploads without their tokens', async () => {
    const { fixture, log } = await start()
    const { app } = fixture.testApp
    const { teamId, userId: targetId, resetToken, invitationToken, packId } = fixture.placeholders
    const adminId = await idOf(fixture, fixture.cookies.admin)
    const editorId = await idOf(fixture, fixture.cookies.editor)
    const from = '203.0.113.77'

    await request(app)
      .post('/api/v1/auth/password-reset')
      .set('X-Forwarded-For', from)
      .send({ email: fixture.emails.target })
      .expect(202)
    await request(app)
      .post('/api/v1/auth/password-reset/confirm')
      .set('X-Forwarded-For', from)
      .send({ token: resetToken, password: newPassword })
      .expect(204)
    await request(app)
      .patch(`/api/v1/teams/${teamId}/members/${targetId}`)
      .set('Cookie', fixture.cookies.admin)
      .set('X-Forwarded-For', from)
      .send({ role: 'editor' })
      .expect(200)
    const invited = await request(app)
      .post(`/api/v1/teams/${teamId}/invitations`)
      .set('Cookie', fixture.cookies.admin)
      .set('X-Forwarded-For', from)
      .send({ email: 'new-hand@crew.example', role: 'viewer' })
    expect(invited.status, JSON.stringify(invited.body)).toBe(201)
    const invitee = await request(app)
      .post('/api/v1/auth/sign-in')
      .send({ email: fixture.emails.invitee, password: strongPassword })
      .expect(200)
    const inviteeCookie = (invitee.headers['set-cookie'] as unknown as string[])[0]!.split(';')[0]!
    await request(app)
      .post('/api/v1/invitations/accept')
      .set('Cookie', inviteeCookie)
      .set('X-Forwarded-For', from)
      .send({ token: invitationToken })
      .expect(200)
    const samples = constantCurrentSamples({
      currentA: 2,
      hours: 1,
      startV: 41,
      endV: 30,
      stepS: 60,
    })
    const uploaded = await request(app)
      .post(`/api/v1/teams/${teamId}/packs/${packId}/discharge-logs`)
      .set('Cookie', fixture.cookies.editor)
      .set('X-Forwarded-For', from)
      .attach('file', Buffer.from(csvOf(samples, plainHeader, plainCells)), 'run.csv')
    expect(uploaded.status, JSON.stringify(uploaded.body)).toBe(201)

    const target = Number(targetId)
    expect(log.events('password-reset-requested')).toEqual([
      expect.objectContaining({ ip: from, accountId: target }),
    ])
    expect(log.events('password-reset-completed')).toEqual([
      expect.objectContaining({ ip: from, accountId: target }),
    ])
    expect(log.events('role-changed')).toEqual([
      expect.objectContaining({
        ip: from,
        accountId: adminId,
        teamId: Number(teamId),
        memberId: target,
        role: 'editor',
      }),
    ])
    expect(log.events('invitation-sent')).toEqual([
      expect.objectContaining({ ip: from, accountId: adminId, teamId: Number(teamId) }),
    ])
    expect(log.events('invitation-accepted')).toEqual([
      expect.objectContaining({ ip: from, teamId: Number(teamId), role: 'viewer' }),
    ])
    expect(log.events('discharge-log-uploaded')).toEqual([
      expect.objectContaining({
        ip: from,
        accountId: editorId,
        packId: Number(packId),
        logId: uploaded.body.id,
      }),
    ])

    const text = log.text()
    for (const secret of [
      resetToken!,
      invitationToken!,
      newPassword,
      strongPassword,
      inviteeCookie.split('=')[1]!,
      fixture.cookies.admin.split('=')[1]!,
    ]) {
      expect(text).not.toContain(secret)
    }
    // The CSV body stays out too.
    expect(text).not.toContain('time_s,voltage_v')
  })

  it('logs sign-ups (new or existing address) and resent confirmations, never the address', async () => {
    const { fixture, log } = await start()
    const { app } = fixture.testApp
    const from = '198.51.100.41'
    const newcomer = 'first-timer@crew.example'
    for (const email of [newcomer, fixture.emails.target]) {
      await request(app)
        .post('/api/v1/auth/sign-up')
        .set('X-Forwarded-For', from)
        .send({ email, name: 'Sam', password: strongPassword })
        .expect(202)
    }
    await fixture.testApp.mail.settled()
    const targetId = Number(fixture.placeholders.userId)
    // OWASP Logging Cheat Sheet: log account creation; a run of sign-ups naming existing
    // accounts from one address is an enumeration attempt the operator should be able to see.
    const signUps = log.events('sign-up')
    expect(signUps).toHaveLength(2)
    expect(signUps).toContainEqual(
      expect.objectContaining({ ip: from, accountCreated: true, accountId: expect.any(Number) }),
    )
    expect(signUps).toContainEqual(
      expect.objectContaining({ ip: from, accountCreated: false, accountId: targetId }),
    )

    const newcomerSignIn = await request(app)
      .post('/api/v1/auth/sign-in')
      .send({ email: newcomer, password: strongPassword })
      .expect(200)
    const cookie = (newcomerSignIn.headers['set-cookie'] as unknown as string[])[0]!.split(';')[0]!
    await request(app)
      .post('/api/v1/auth/email-verification')
      .set('Cookie', cookie)
      .set('X-Forwarded-For', from)
      .expect(202)
    expect(log.events('email-verification-resent')).toEqual([
      expect.objectContaining({ ip: from, accountId: newSignUpId(signUps) }),
    ])
    expect(log.text()).not.toContain(newcomer)
    expect(log.text()).not.toContain(strongPassword)
  })

  it('censors secret-named fields a caller passes by mistake', async () => {
    const log = captureLog()
    log.logger.info({ event: 'x', password: 'p4ss', details: { token: 't0k' } }, 'x')
    const [line] = log.lines()
    expect(line).toMatchObject({ password: '[redacted]', details: { token: '[redacted]' } })
  })
})
