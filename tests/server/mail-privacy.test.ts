import { mkdtempSync, readdirSync, readFileSync, rmSync, statSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import request from 'supertest'
import { afterEach, describe, expect, it } from 'vitest'
import { emailVerifications, passwordResets, users } from '../../server/db/schema'
import type { BackgroundMail } from '../../server/mail/mailer'
import { createOperatorCopy, keptMailFiles } from '../../server/mail/operator-copy'
import {
  fakeClock,
  mailsTo,
  signInCookie,
  signUp,
  strongPassword,
  tokenInMail,
} from '../helpers/accounts'
import { createTestApp, type TestApp, type TestAppOptions } from '../helpers/test-app'

// Mail that opens an account reaches its addressee alone; who has an account stays private;
// only confirmed addresses make the app send mail, within a team's daily allowance.

let testApp: TestApp | undefined
afterEach(async () => {
  await testApp?.close()
  testApp = undefined
})

function start(overrides: Record<string, string> = {}, options: TestAppOptions = {}): TestApp {
  testApp = createTestApp(overrides, options)
  return testApp
}

const outboxOf = async (app: TestApp, cookie: string) =>
  (await request(app.app).get('/api/v1/dev/outbox').set('Cookie', cookie).expect(200)).body
    .messages as { to: string; subject: string; text: string; html: string }[]

const invite = (app: TestApp, cookie: string, teamId: number, email: string) =>
  request(app.app)
    .post(`/api/v1/teams/${teamId}/invitations`)
    .set('Cookie', cookie)
    .send({ email, role: 'viewer' })

/** Holds the mailer's background work instead of running it, to show what the answer did alone. */
function holdBackgroundWork(app: TestApp): BackgroundMail[] {
  const held: BackgroundMail[] = []
  app.mail.sendInBackground = (mail) => {
    held.push(mail)
  }
  return held
}

describe('a reset link reaches its addressee only', () => {
  it('stays out of the outbox of the admin who invited the account (the takeover path)', async () => {
    const printed: string[] = []
    const app = start({}, { print: (text) => printed.push(text) })
    const attacker = await signUp(app, 'mallory@crew.example', 'Mallory')
    const teamId = attacker.me.teams[0]!.id
    await invite(app, attacker.cookie, teamId, 'victim@crew.example').expect(201)
    const victim = await signUp(app, 'victim@crew.example', 'Vic')
    const invitation = mailsTo(app, 'victim@crew.example').find((mail) =>
      mail.text.includes('/invitations/accept?token='),
    )
    await request(app.app)
      .post('/api/v1/invitations/accept')
      .set('Cookie', victim.cookie)
      .send({ token: tokenInMail(invitation!.text) })
      .expect(200)

    await request(app.app)
      .post('/api/v1/auth/password-reset')
      .send({ email: 'victim@crew.example' })
      .expect(202)
    await app.mail.settled()

    // Source: OWASP Forgot Password Cheat Sheet (the reset token goes to the account's own
    // channel only). The attacker still sees what their team sent: the invitation.
    const seenByAttacker = await outboxOf(app, attacker.cookie)
    expect(seenByAttacker.map((mail) => mail.subject)).toContain(
      'An invitation to a team on Loudhour',
    )
    expect(seenByAttacker.some((mail) => mail.text.includes('/reset-password?token='))).toBe(false)
    expect(
      seenByAttacker.some(
        (mail) => mail.to === 'victim@crew.example' && !mail.text.includes('/invitations/accept'),
      ),
    ).toBe(false)
    // The victim reads their own reset link.
    const seenByVictim = await outboxOf(app, victim.cookie)
    expect(seenByVictim[0]?.subject).toBe('Reset your Loudhour password')
    expect(seenByVictim[0]?.text).toContain('http://localhost:3999/reset-password?token=')

    // The operator has it outside the app: an .eml file readable by the owner only, and the console.
    const mailDir = join(app.dataDir, 'mail')
    // Source: POSIX file modes: 0700 (rwx owner only) for the folder, 0600 (rw owner only) files.
    expect(statSync(mailDir).mode & 0o777).toBe(0o700)
    const files = readdirSync(mailDir).filter((name) => name.endsWith('.eml'))
    const resetFile = files
      .map((name) => join(mailDir, name))
      .find((file) => readFileSync(file, 'utf8').includes('Subject: Reset your Loudhour password'))
    expect(resetFile).toBeDefined()
    expect(statSync(resetFile!).mode & 0o777).toBe(0o600)
    for (const name of files) expect(statSync(join(mailDir, name)).mode & 0o777).toBe(0o600)
    const consoleCopy = printed.find((text) => text.includes('"Reset your Loudhour password"'))
    expect(consoleCopy).toContain(`mail to victim@crew.example: `)
    expect(consoleCopy).toContain(resetFile!)
    expect(consoleCopy).toContain('/reset-password?token=')
  })

  it('shows nothing addressed to an unconfirmed address, even to its account', async () => {
    const app = start()
    // Whoever signed up with an address has not shown that they read its mail.
    const squatter = await signUp(app, 'pat@crew.example', 'Pat', { confirmed: false })
    expect(await outboxOf(app, squatter.cookie)).toEqual([])
    expect(mailsTo(app, 'pat@crew.example')[0]?.subject).toBe('Confirm your address for Loudhour')
  })
})

describe('who has an account stays private', () => {
  it('answers a reset request before looking the address up', async () => {
    const app = start()
    await signUp(app, 'pat@crew.example')
    const held = holdBackgroundWork(app)
    const known = await request(app.app)
      .post('/api/v1/auth/password-reset')
      .send({ email: 'pat@crew.example' })
      .expect(202)
    const unknown = await request(app.app)
      .post('/api/v1/auth/password-reset')
      .send({ email: 'nobody@crew.example' })
      .expect(202)
    // Source: OWASP Forgot Password Cheat Sheet ("return a consistent message for both existent
    // and non-existent accounts", and the same time: do the work after answering).
    expect(known.body).toEqual(unknown.body)
    // Both answers are out, and no token exists yet: the answer did not wait for any of it.
    expect(app.database.db.select().from(passwordResets).all()).toEqual([])
    expect(held).toHaveLength(2)
    const [forKnown, forUnknown] = held
    expect(typeof forKnown).toBe('function')
    const mail = await (forKnown as () => Promise<{ subject: string } | undefined>)()
    expect(mail?.subject).toBe('Reset your Loudhour password')
    expect(app.database.db.select().from(passwordResets).all()).toHaveLength(1)
    expect(await (forUnknown as () => Promise<unknown>)()).toBeUndefined()
  })

  it('answers a sign-up before hashing or looking the address up', async () => {
    const app = start()
    const held = holdBackgroundWork(app)
    await request(app.app)
      .post('/api/v1/auth/sign-up')
      .send({ email: 'pat@crew.example', name: 'Pat', password: strongPassword })
      .expect(202)
    expect(app.database.db.select().from(users).all()).toEqual([])
    const [work] = held
    const mail = await (work as () => Promise<{ to: string; subject: string; text: string }>)()
    expect(mail.to).toBe('pat@crew.example')
    expect(mail.subject).toBe('Confirm your address for Loudhour')
    expect(mail.text).toMatch(/http:\/\/localhost:3999\/verify-email\?token=[A-Za-z0-9_-]{43}/)
    expect(app.database.db.select().from(users).all()).toHaveLength(1)
  })

  it('limits sign-up mail to one address to five an hour', async () => {
    const app = start()
    const attempt = () =>
      request(app.app)
        .post('/api/v1/auth/sign-up')
        .send({ email: 'pat@crew.example', name: 'Pat', password: strongPassword })
    // Five an hour is ours (README, "Accounts and mail"), after OWASP Authentication Cheat Sheet's
    // advice to throttle what an unauthenticated caller can make the server send.
    for (let count = 0; count < 5; count += 1) await attempt().expect(202)
    const refused = await attempt().expect(429)
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0)
    await app.mail.settled()
    // One account, then four notes that it exists already.
    expect(app.database.db.select().from(users).all()).toHaveLength(1)
    expect(mailsTo(app, 'pat@crew.example').map((mail) => mail.subject)).toEqual([
      ...Array<string>(4).fill('You already have a Loudhour account'),
      'Confirm your address for Loudhour',
    ])
  })
})

describe('only confirmed addresses send mail', () => {
  it('refuses invitations and cards until the link is opened, and the link works once', async () => {
    const time = fakeClock()
    const app = start({}, { clock: time.clock })
    const pat = await signUp(app, 'pat@crew.example', 'Pat', { confirmed: false })
    const teamId = pat.me.teams[0]!.id
    // Common practice for services that send mail for their users: only from a confirmed address.
    const refused = await invite(app, pat.cookie, teamId, 'sam@crew.example').expect(403)
    expect(refused.body.error.code).toBe('email-unverified')
    expect(refused.body.error.message).toContain('pat@crew.example')

    const first = tokenInMail(mailsTo(app, 'pat@crew.example')[0]!.text)
    await request(app.app)
      .post('/api/v1/auth/email-verification')
      .set('Cookie', pat.cookie)
      .expect(202)
    await app.mail.settled()
    const again = tokenInMail(mailsTo(app, 'pat@crew.example')[0]!.text)
    expect(again).not.toBe(first)

    const confirm = (token: string) =>
      request(app.app).post('/api/v1/auth/email-verification/confirm').send({ token })
    await confirm(again).expect(204)
    // Single use, and the older link is spent with it (OWASP Forgot Password Cheat Sheet: tokens
    // are single use; the same holds for any mailed link that proves a mailbox).
    const reused = await confirm(again).expect(400)
    expect(reused.body.error.issues).toEqual([
      {
        path: 'token',
        message:
          'This confirmation link is not valid, was used already or has expired; ask for a new one',
      },
    ])
    await confirm(first).expect(400)
    const me = await request(app.app).get('/api/v1/auth/me').set('Cookie', pat.cookie).expect(200)
    expect(me.body.emailVerified).toBe(true)
    await invite(app, pat.cookie, teamId, 'sam@crew.example').expect(201)
    const already = await request(app.app)
      .post('/api/v1/auth/email-verification')
      .set('Cookie', pat.cookie)
      .expect(409)
    expect(already.body.error.code).toBe('already-verified')
  })

  it('lets a confirmation link expire after 48 hours', async () => {
    const time = fakeClock()
    const app = start({}, { clock: time.clock })
    await signUp(app, 'pat@crew.example', 'Pat', { confirmed: false })
    const token = tokenInMail(mailsTo(app, 'pat@crew.example')[0]!.text)
    // 48 hours is ours (README, "Accounts and mail"); OWASP Forgot Password Cheat Sheet asks only
    // that mailed tokens expire.
    time.advance(48 * 60 * 60 * 1000)
    await request(app.app)
      .post('/api/v1/auth/email-verification/confirm')
      .send({ token })
      .expect(400)
    expect(app.database.db.select().from(emailVerifications).all()[0]?.usedAtMs).toBeNull()
  })

  // A reset link reaches only the account's mailbox, so using it proves that mailbox as well.
  it('counts a completed password reset as a confirmed address', async () => {
    const app = start()
    await signUp(app, 'pat@crew.example', 'Pat', { confirmed: false })
    await request(app.app)
      .post('/api/v1/auth/password-reset')
      .send({ email: 'pat@crew.example' })
      .expect(202)
    await app.mail.settled()
    const token = tokenInMail(mailsTo(app, 'pat@crew.example')[0]!.text)
    await request(app.app)
      .post('/api/v1/auth/password-reset/confirm')
      .send({ token, password: 'copper lantern drifts slowly 73' })
      .expect(204)
    const cookie = await signInCookie(
      app.app,
      'pat@crew.example',
      'copper lantern drifts slowly 73',
    )
    const me = await request(app.app).get('/api/v1/auth/me').set('Cookie', cookie).expect(200)
    expect(me.body.emailVerified).toBe(true)
  })
})

describe("a team's daily mail cap", () => {
  it('answers 429 with Retry-After at TEAM_MAIL_DAILY_LIMIT, and frees up a day later', async () => {
    const time = fakeClock()
    const app = start({ TEAM_MAIL_DAILY_LIMIT: '2' }, { clock: time.clock })
    const ada = await signUp(app, 'ada@crew.example', 'Ada')
    const teamId = ada.me.teams[0]!.id
    await invite(app, ada.cookie, teamId, 'one@crew.example').expect(201)
    time.advance(60 * 60 * 1000)
    await invite(app, ada.cookie, teamId, 'two@crew.example').expect(201)
    const capped = await invite(app, ada.cookie, teamId, 'three@crew.example').expect(429)
    expect(capped.body.error.code).toBe('team-mail-cap')
    // RFC 9110 §10.2.3: Retry-After in seconds. The first message is 1 h old, so room comes in
    // 23 h = 82,800 s.
    expect(capped.headers['retry-after']).toBe('82800')
    time.advance(23 * 60 * 60 * 1000)
    await invite(app, ada.cookie, teamId, 'three@crew.example').expect(201)
    // Another team has its own allowance.
    const team = await request(app.app)
      .post('/api/v1/teams')
      .set('Cookie', ada.cookie)
      .send({ name: 'Second crew' })
      .expect(201)
    await invite(app, ada.cookie, team.body.team.id, 'four@crew.example').expect(201)
  })
})

describe('subjects carry nothing a sender typed', () => {
  it('keeps the team and inviter names in the body, escaped, and out of the subject', async () => {
    const app = start()
    const name = 'URGENT <b>payroll</b> & login required'
    const ada = await signUp(app, 'ada@crew.example', name)
    const team = await request(app.app)
      .post('/api/v1/teams')
      .set('Cookie', ada.cookie)
      .send({ name: 'Your account is suspended' })
      .expect(201)
    await invite(app, ada.cookie, team.body.team.id, 'sam@crew.example').expect(201)
    const [mail] = await outboxOf(app, ada.cookie)
    expect(mail?.subject).toBe('An invitation to a team on Loudhour')
    expect(mail?.html).toContain('URGENT &lt;b&gt;payroll&lt;/b&gt; &amp; login required')
    expect(mail?.text).toContain('"Your account is suspended"')
  })
})

describe('names are one line of text', () => {
  it('refuses CR, LF, NUL and other control characters with a 400 naming the field', async () => {
    const app = start()
    const ada = await signUp(app, 'ada@crew.example', 'Ada')
    const refusedPath = async (call: request.Test) => {
      const answer = await call.expect(400)
      return answer.body.error.issues.map((issue: { path: string }) => issue.path)
    }
    // Source: RFC 5322 §2.2 (a header field ends at CRLF, so a CR or LF in a name could end one)
    // and Unicode's C0 set U+0000–U+001F.
    for (const bad of ['Ada\r\nBcc: all@crew.example', 'Ada\u0000', 'A\tda', 'Ada\u0085Lovelace']) {
      expect(
        await refusedPath(
          request(app.app)
            .post('/api/v1/auth/sign-up')
            .send({ email: 'new@crew.example', name: bad, password: strongPassword }),
        ),
      ).toEqual(['name'])
      expect(
        await refusedPath(
          request(app.app).patch('/api/v1/auth/me').set('Cookie', ada.cookie).send({ name: bad }),
        ),
      ).toEqual(['name'])
      expect(
        await refusedPath(
          request(app.app).post('/api/v1/teams').set('Cookie', ada.cookie).send({ name: bad }),
        ),
      ).toEqual(['name'])
    }
    const teamId = ada.me.teams[0]!.id
    const pack = await request(app.app)
      .post(`/api/v1/teams/${teamId}/packs`)
      .set('Cookie', ada.cookie)
      .send({ name: 'Pack\nTwo' })
      .expect(400)
    expect(pack.body.error.issues.map((issue: { path: string }) => issue.path)).toContain('name')
    // Nothing was half-written: the name is as it was, and there is still one team.
    const me = await request(app.app).get('/api/v1/auth/me').set('Cookie', ada.cookie).expect(200)
    expect(me.body.user.name).toBe('Ada')
    expect(me.body.teams).toHaveLength(1)
  })
})

describe("the operator's copy", () => {
  it('keeps the newest files only, so a flood of mail cannot fill the disk', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'loudhour-mail-copy-'))
    try {
      const copy = createOperatorCopy({ mailDir: join(dir, 'mail'), print: () => {} })
      const startMs = Date.parse('2026-05-02T09:00:00Z')
      for (let index = 0; index < keptMailFiles + 3; index += 1) {
        copy({
          id: `m${index}`,
          to: 'pat@crew.example',
          subject: 'Reset your Loudhour password',
          text: 'x',
          raw: 'Subject: x\r\n\r\nx',
          receivedAt: new Date(startMs + index * 1000),
        })
      }
      const files = readdirSync(join(dir, 'mail')).sort()
      expect(files).toHaveLength(keptMailFiles)
      // The three oldest went; the newest stays.
      expect(files[0]).toBe('2026-05-02T09-00-03.000Z-m3.eml')
      expect(files.at(-1)).toContain(`-m${keptMailFiles + 2}.eml`)
    } finally {
      rmSync(dir, { recursive: true, force: true })
    }
  })
})
