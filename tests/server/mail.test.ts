import request from 'supertest'
import { SMTPServer } from 'smtp-server'
import { afterEach, describe, expect, it } from 'vitest'
import { createMailer } from '../../server/mail/mailer'
import { invitationMail } from '../../server/mail/templates'
import { signUp } from '../helpers/accounts'
import { createTestApp, type TestApp } from '../helpers/test-app'

let testApp: TestApp | undefined
afterEach(async () => {
  await testApp?.close()
  testApp = undefined
})

const message = (to: string, teamId: number) => ({
  ...invitationMail({
    to,
    teamId: 1,
    teamName: 'Crew',
    inviterName: 'Ada',
    role: 'viewer',
    url: 'http://x.example/a',
  }),
  sentByTeamId: teamId,
})

describe('the built-in mail catcher', () => {
  it('receives messages over a real SMTP conversation on loopback', async () => {
    const mailer = createMailer({
      smtpUrl: undefined,
      from: 'Loudhour <no-reply@loudhour.invalid>',
      clock: () => new Date(),
      log: () => {},
    })
    try {
      const port = await mailer.start()
      expect(port).toBeGreaterThan(0)
      await mailer.send(message('sam@crew.example', 1))
      const [received] =
        mailer.outbox?.listFor({ adminTeamIds: [1], verifiedEmail: undefined }) ?? []
      // The recipient comes from the SMTP envelope (RCPT TO), so it proves the message went through.
      expect(received?.to).toBe('sam@crew.example')
      expect(received?.subject).toBe('An invitation to a team on Loudhour')
      expect(received?.html).toContain('<a href="http://x.example/a"')
      expect(received?.text).toContain('Accept the invitation: http://x.example/a')
      expect(mailer.outbox?.listFor({ adminTeamIds: [2], verifiedEmail: undefined })).toEqual([])
    } finally {
      await mailer.close()
    }
  })

  it('sends to SMTP_URL when set, and then has no outbox route', async () => {
    const received: string[] = []
    const server = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      logger: false,
      onData(stream, session, callback) {
        stream.on('data', () => {})
        stream.on('end', () => {
          received.push(...session.envelope.rcptTo.map((recipient) => recipient.address))
          callback()
        })
      },
    })
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve))
    const address = server.server.address()
    const port = typeof address === 'object' && address ? address.port : 0
    try {
      testApp = createTestApp({ SMTP_URL: `smtp://127.0.0.1:${port}` })
      const admin = await signUp(testApp, 'admin@crew.example')
      expect(admin.me.devOutbox).toBe(false)
      await request(testApp.app)
        .post(`/api/v1/teams/${admin.me.teams[0]?.id}/invitations`)
        .set('Cookie', admin.cookie)
        .send({ email: 'sam@crew.example', role: 'viewer' })
        .expect(201)
      // The sign-up's confirmation link, then the invitation: both through the real server.
      expect(received).toEqual(['admin@crew.example', 'sam@crew.example'])
      // Source: README.md, configuration (the catcher and its outbox only without SMTP_URL).
      await request(testApp.app).get('/api/v1/dev/outbox').set('Cookie', admin.cookie).expect(404)
    } finally {
      await new Promise<void>((resolve) => server.close(() => resolve()))
    }
  })

  it('shows each admin only the mail of their own teams, and escapes names in HTML', async () => {
    testApp = createTestApp()
    const alder = await signUp(testApp, 'admin@alder.example', 'Ada')
    const harbor = await signUp(testApp, 'admin@harbor.example', 'Kit')
    const team = await request(testApp.app)
      .post('/api/v1/teams')
      .set('Cookie', alder.cookie)
      .send({ name: '<b>Fish & Chips</b>' })
      .expect(201)
    await request(testApp.app)
      .post(`/api/v1/teams/${team.body.team.id}/invitations`)
      .set('Cookie', alder.cookie)
      .send({ email: 'sam@crew.example', role: 'viewer' })
      .expect(201)
    const alderOutbox = await request(testApp.app)
      .get('/api/v1/dev/outbox')
      .set('Cookie', alder.cookie)
      .expect(200)
    // Ada's own confirmation mail is hers to read too; the invitation is the newest.
    const [mail] = alderOutbox.body.messages
    expect(mail.subject).toBe('An invitation to a team on Loudhour')
    expect(mail.html).toContain('&lt;b&gt;Fish &amp; Chips&lt;/b&gt;')
    expect(mail.html).not.toContain('<b>Fish')
    expect(mail.text).toContain('"<b>Fish & Chips</b>"')
    expect(Date.parse(mail.date)).not.toBeNaN()
    const harborOutbox = await request(testApp.app)
      .get('/api/v1/dev/outbox')
      .set('Cookie', harbor.cookie)
      .expect(200)
    expect(
      harborOutbox.body.messages.map((message: { subject: string }) => message.subject),
    ).toEqual(['Confirm your address for Loudhour'])
    expect(harborOutbox.body.messages[0].to).toBe('admin@harbor.example')
  })
})
