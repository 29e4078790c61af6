import fc from 'fast-check'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { estimateResultSchema } from '../../shared/schemas/estimate'
import { columnRig } from '../shared/rig-fixtures'
import { createTestApp, type TestApp } from '../helpers/test-app'
import { postUntilThrottled } from '../helpers/throttle'

let testApp: TestApp
beforeAll(() => {
  testApp = createTestApp()
})
afterAll(() => testApp.close())

describe('POST /api/v1/estimate', () => {
  it('answers a valid rig with the contract result, without signing in', async () => {
    const response = await request(testApp.app)
      .post('/api/v1/estimate')
      .send(columnRig())
      .expect(200)
    const result = estimateResultSchema.parse(response.body)
    // Common practice: two banks of 3 × 8 ohm in parallel, in series, are 5.33 ohm per channel.
    expect(result.loadOhm).toBeCloseTo(16 / 3, 6)
    // Common practice: a "20 V max" pack is 5 cells of 3.6 V, 18 V nominal; 2 × 2.5 Ah = 5 Ah → 90 Wh.
    expect(result.energyWh.nominal).toBeCloseTo(90, 6)
    expect(result.airlineClass).toBe('up-to-100wh')
    expect(result.runtimeHours).toBeGreaterThan(0)
    expect(result.timeline.length).toBeLessThanOrEqual(500)
  })

  it('names the field of a value that is not physical', async () => {
    const rig = columnRig()
    const response = await request(testApp.app)
      .post('/api/v1/estimate')
      .send({ ...rig, pack: { ...rig.pack, seriesCells: 0 } })
      .expect(400)
    expect(response.body.error.code).toBe('invalid-input')
    expect(response.body.error.issues).toContainEqual({
      path: 'pack.seriesCells',
      message: expect.stringContaining('Cells in series'),
    })
  })

  it('refuses an unknown chemistry and an efficiency above 1, naming both', async () => {
    const rig = columnRig()
    const response = await request(testApp.app)
      .post('/api/v1/estimate')
      .send({
        ...rig,
        pack: { ...rig.pack, chemistry: 'plutonium' },
        amplifier: { ...rig.amplifier, efficiency: 1.2 },
      })
      .expect(400)
    const paths = response.body.error.issues.map((issue: { path: string }) => issue.path)
    expect(paths).toEqual(expect.arrayContaining(['pack.chemistry', 'amplifier.efficiency']))
  })

  it('answers malformed JSON with 400 in the error shape', async () => {
    const response = await request(testApp.app)
      .post('/api/v1/estimate')
      .set('Content-Type', 'application/json')
      .send('{"pack": {')
      .expect(400)
    expect(response.body.error.code).toBe('malformed-json')
    // The documented error shape (docs/estimate-api.md): every 400 carries an issues list.
    expect(response.body.error.issues).toEqual([
      { path: '', message: 'The request body is not valid JSON' },
    ])
  })

  it('never answers 500, whatever JSON arrives', async () => {
    await fc.assert(
      fc.asyncProperty(fc.jsonValue(), async (body) => {
        const response = await request(testApp.app)
          .post('/api/v1/estimate')
          .set('Content-Type', 'application/json')
          .send(JSON.stringify(body))
        expect([200, 400]).toContain(response.status)
        expect(response.body.error ?? response.body.runtimeHours).toBeDefined()
      }),
      { numRuns: 60, seed: 20261201 },
    )
  })

  it('throttles one address after its minute allowance, with Retry-After', async () => {
    const throttled = await postUntilThrottled('/api/v1/estimate', 130)
    expect(throttled.status).toBe(429)
    expect(Number(throttled.retryAfter)).toBeGreaterThan(0)
  })
})
