// `npm run bench`: how long /api/health takes to answer while three 3.7 MB discharge logs upload
// at once, against the same server idle. Logs are parsed on a worker thread, so the event loop
// should stay free; the figures are printed, never asserted.
import type { Server } from 'node:http'
import type { AddressInfo } from 'node:net'
import { afterAll, beforeAll, bench, describe } from 'vitest'
import { createTeamFixture, type TeamFixture } from '../helpers/team-fixture'

let fixture: TeamFixture
let server: Server
let baseUrl: string
let logBytes: Uint8Array<ArrayBuffer>
const idleMs: number[] = []
const duringMs: number[] = []
const uploadMs: number[] = []

/** A log of at least `targetBytes`: 1 s samples, 2 A, falling from 41 V to the fixture pack's
 * 30 V cutoff (10 cells × 3 V). */
function largeLog(targetBytes: number): Uint8Array<ArrayBuffer> {
  const header = 'time_s,voltage_v,current_a'
  // Rows are 19 to 22 bytes, 21.4 on average over a run this long.
  const rows = Math.ceil(targetBytes / 21.4)
  const lines = [header]
  for (let row = 0; row < rows; row += 1) {
    const voltageV = 41 - (11 * row) / (rows - 1)
    lines.push(`${row},${voltageV.toFixed(4)},2.0000`)
  }
  return new TextEncoder().encode(lines.join('\n') + '\n')
}

async function healthLatencyMs(): Promise<number> {
  const startedMs = performance.now()
  const answer = await fetch(`${baseUrl}/api/health`)
  await answer.arrayBuffer()
  return performance.now() - startedMs
}

async function upload(cookie: string): Promise<void> {
  const { teamId, packId } = fixture.placeholders
  const form = new FormData()
  form.set('file', new Blob([logBytes], { type: 'text/csv' }), 'run.csv')
  const startedMs = performance.now()
  const answer = await fetch(`${baseUrl}/api/v1/teams/${teamId}/packs/${packId}/discharge-logs`, {
    method: 'POST',
    headers: { Cookie: cookie },
    body: form,
  })
  if (answer.status !== 201)
    throw new Error(`upload answered ${answer.status}: ${await answer.text()}`)
  uploadMs.push(performance.now() - startedMs)
}

const median = (values: number[]) => {
  const sorted = [...values].sort((a, b) => a - b)
  return sorted[Math.floor(sorted.length / 2)] ?? NaN
}
const percentile = (values: number[], share: number) =>
  [...values].sort((a, b) => a - b)[
    Math.min(values.length - 1, Math.floor(values.length * share))
  ] ?? NaN

beforeAll(async () => {
  fixture = await createTeamFixture()
  logBytes = largeLog(3.7e6)
  server = fixture.testApp.app.listen(0, '127.0.0.1')
  await new Promise((resolve) => server.once('listening', resolve))
  baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`
  // The parser thread starts with the first upload; start it before measuring.
  await upload(fixture.cookies.admin)
  uploadMs.length = 0
  for (let probe = 0; probe < 200; probe += 1) idleMs.push(await healthLatencyMs())
}, 120_000)

afterAll(async () => {
  const ms = (value: number) => `${value.toFixed(1)} ms`
  console.log(
    `\n/api/health while idle: median ${ms(median(idleMs))}, 95th percentile ${ms(percentile(idleMs, 0.95))} (${idleMs.length} requests).` +
      `\n/api/health during three concurrent ${(logBytes.length / 1e6).toFixed(1)} MB uploads: ` +
      `median ${ms(median(duringMs))}, 95th percentile ${ms(percentile(duringMs, 0.95))}, slowest ${ms(Math.max(...duringMs))} (${duringMs.length} requests).` +
      `\nEach upload took a median ${ms(median(uploadMs))} (${uploadMs.length} uploads).`,
  )
  server?.closeAllConnections()
  server?.close()
  await fixture?.testApp.close()
})

describe('uploads beside other requests', () => {
  bench(
    'three concurrent 3.7 MB discharge-log uploads while /api/health is polled',
    async () => {
      let uploading = true
      // Two per account may be in progress at once: the editor sends two, the admin one.
      const uploads = Promise.all([
        upload(fixture.cookies.editor),
        upload(fixture.cookies.editor),
        upload(fixture.cookies.admin),
      ]).finally(() => (uploading = false))
      while (uploading) duringMs.push(await healthLatencyMs())
      await uploads
    },
    { iterations: 3, warmupIterations: 0, time: 0 },
  )
})
