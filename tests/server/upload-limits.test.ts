import { request as httpRequest, type ClientRequest, type Server } from 'node:http'
import type { AddressInfo } from 'node:net'
import request from 'supertest'
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { dischargeLogs } from '../../server/db/schema-resources'
import { constantCurrentSamples, csvOf, plainCells, plainHeader } from '../helpers/discharge-logs'
import { createTeamFixture, type SignedInActor, type TeamFixture } from '../helpers/team-fixture'

/*
 * Uploads do not starve everyone else: an account has at most two uploads in progress (ours;
 * enough for a second tab), the third is 429 with Retry-After, and others are not held up.
 * Logs are parsed on a worker thread; these uploads go through it.
 */

let fixture: TeamFixture
let server: Server
let baseUrl: string
const hanging: ClientRequest[] = []

beforeEach(async () => {
  fixture = await createTeamFixture()
  fixture.testApp.database.db.delete(dischargeLogs).run()
  server = fixture.testApp.app.listen(0, '127.0.0.1')
  await new Promise((resolve) => server.once('listening', resolve))
  baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`
})
afterEach(async () => {
  for (const stuck of hanging.splice(0)) stuck.destroy()
  server.closeAllConnections()
  await new Promise((resolve) => server.close(resolve))
  await fixture.testApp.close()
})

const logsPath = () =>
  `/api/v1/teams/${fixture.placeholders.teamId}/packs/${fixture.placeholders.packId}/discharge-logs`

// 2 A for an hour down to the fixture pack's 30 V cutoff (10 cells × 3 V).
const goodLog = csvOf(
  constantCurrentSamples({ currentA: 2, hours: 1, startV: 41, endV: 30, stepS: 60 }),
  plainHeader,
  plainCells,
)

/** An upload that sends its headers and the start of its form, then stalls (a slow phone). */
function stalledUpload(actor: SignedInActor): void {
  const boundary = 'stalled-upload-boundary'
  const stuck = httpRequest(`${baseUrl}${logsPath()}`, {
    method: 'POST',
    headers: {
      Cookie: fixture.cookies[actor],
      'Content-Type': `multipart/form-data; boundary=${boundary}`,
      'Content-Length': String(3 * 1024 * 1024),
    },
  })
  stuck.on('error', () => {})
  stuck.write(
    `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="run.csv"\r\n` +
      `Content-Type: text/csv\r\n\r\n${plainHeader}\n0,41,2\n`,
  )
  hanging.push(stuck)
}

const upload = (actor: SignedInActor) =>
  request(baseUrl)
    .post(logsPath())
    .set('Cookie', fixture.cookies[actor])
    .attach('file', Buffer.from(goodLog), 'run.csv')

describe('concurrent uploads', { timeout: 60_000 }, () => {
  it('refuses a third upload in progress for one account with 429, not other accounts', async () => {
    stalledUpload('editor')
    stalledUpload('editor')
    // The stalled ones take their slots as soon as the server has read their headers.
    const refused = await vi.waitFor(
      async () => {
        const answer = await upload('editor')
        if (answer.status !== 429) throw new Error(`not yet refused: ${answer.status}`)
        return answer
      },
      { timeout: 20_000, interval: 200 },
    )
    expect(refused.body.error.code).toBe('throttled')
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0)
    const stored = await fixture.testApp.database.db.$count(dischargeLogs)
    // Another account of the team uploads meanwhile.
    const admin = await upload('admin')
    expect(admin.status, JSON.stringify(admin.body)).toBe(201)
    expect(await fixture.testApp.database.db.$count(dischargeLogs)).toBe(stored + 1)
  })

  it("frees the account's slots when its uploads end", async () => {
    stalledUpload('editor')
    stalledUpload('editor')
    await vi.waitFor(
      async () => {
        if ((await upload('editor')).status !== 429) throw new Error('not yet refused')
      },
      { timeout: 20_000, interval: 200 },
    )
    for (const stuck of hanging.splice(0)) stuck.destroy()
    const answer = await vi.waitFor(
      async () => {
        const attempt = await upload('editor')
        if (attempt.status === 429) throw new Error('still refused')
        return attempt
      },
      { timeout: 20_000, interval: 200 },
    )
    expect(answer.status, JSON.stringify(answer.body)).toBe(201)
    expect(answer.body.deliveredAh).toBeCloseTo(2, 9) // 2 A × 1 h (definition of the ampere-hour)
  })
})
