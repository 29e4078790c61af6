import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { compareResultSchema } from '../../shared/schemas/compare'
import type { EstimateRequestInput } from '../../shared/schemas/estimate'
import { columnRig } from '../shared/rig-fixtures'
import { createTestApp, type TestApp } from '../helpers/test-app'
import { postUntilThrottled } from '../helpers/throttle'

// POST /api/v1/compare: one rig against many packs, no sign-in (docs/estimate-api.md).

let testApp: TestApp
beforeAll(() => {
  testApp = createTestApp()
})
afterAll(() => testApp.close())

const toolPack = (seriesCells: number, parallelCells: number, extra = {}) => ({
  chemistry: 'li-ion' as const,
  seriesCells,
  parallelCells,
  cellCapacityAh: 2.5,
  maxDischargeA: 20 * parallelCells,
  ...extra,
})
const rig: EstimateRequestInput = columnRig()
const compare = (body: unknown) =>
  request(testApp.app)
    .post('/api/v1/compare')
    .send(body as object)

describe('POST /api/v1/compare', () => {
  it('answers one row per pack, in the order given, without signing in', async () => {
    const response = await compare({
      rig,
      packs: [toolPack(5, 2, { massKg: 0.6, price: 90 }), toolPack(10, 2), toolPack(5, 1)],
    }).expect(200)
    const { rows } = compareResultSchema.parse(response.body)
    expect(rows).toHaveLength(3)
    // Common practice: 5 × 3.6 V × 2 × 2.5 Ah = 90 Wh nominal; 90 Wh over 0.6 kg is 150 Wh/kg;
    // 10 cells are 180 Wh; one string of 5 is 45 Wh.
    expect(rows.map((row) => row.energyWh.nominal)).toEqual([
      expect.closeTo(90, 9),
      expect.closeTo(180, 9),
      expect.closeTo(45, 9),
    ])
    expect(rows[0]!.whPerKg).toBeCloseTo(150, 9)
    expect(rows[0]!.costPerHour).toBeGreaterThan(0)
    expect(rows[1]!.whPerKg).toBeUndefined()
    // Without a schedule there is no day to last.
    expect(rows[0]!.lasts).toBeUndefined()
    // Common practice: 10 li-ion cells are 42 V off the charger, over the board's 26 V.
    expect(rows[0]).toMatchObject({ fits: true, problems: [] })
    expect(rows[1]!.fits).toBe(false)
    expect(rows[1]!.problems.length).toBeGreaterThan(0)
    // IATA lithium battery guidance: up to 100 Wh in carry-on, over 160 Wh not in passenger
    // baggage.
    expect(rows[0]!.airlineClass).toBe('up-to-100wh')
    expect(rows[1]!.airlineClass).toBe('over-160wh')
    // Definition of the ampere-hour: half the charge at the same draw runs shorter.
    expect(rows[2]!.runtimeHours).toBeLessThan(rows[0]!.runtimeHours)
  })

  it('says whether each pack lasts a schedule', async () => {
    const response = await compare({
      rig: { ...rig, schedule: [{ label: 'Set', minutes: 30 }] },
      packs: [toolPack(5, 2)],
    }).expect(200)
    expect(response.body.rows[0].lasts).toBe(true)
  })

  it('names the field of a bad pack, and of a bad rig', async () => {
    const response = await compare({
      rig: { ...rig, amplifier: { ...rig.amplifier, efficiency: 1.5 } },
      packs: [toolPack(5, 2), { ...toolPack(5, 2), seriesCells: 0 }],
    }).expect(400)
    expect(response.body.error.code).toBe('invalid-input')
    const paths = response.body.error.issues.map((issue: { path: string }) => issue.path)
    expect(paths).toEqual(
      expect.arrayContaining(['packs.1.seriesCells', 'rig.amplifier.efficiency']),
    )
  })

  it('refuses an empty list and more than 60 packs with 400 naming packs', async () => {
    for (const packs of [[], Array.from({ length: 61 }, () => toolPack(5, 2))]) {
      const response = await compare({ rig, packs }).expect(400)
      expect(response.body.error.issues).toContainEqual({
        path: 'packs',
        message: expect.stringMatching(/pack/),
      })
    }
    const missing = await compare({ rig }).expect(400)
    expect(missing.body.error.issues.map((issue: { path: string }) => issue.path)).toContain(
      'packs',
    )
  })

  it('answers malformed JSON with 400 in the error shape, never 500', async () => {
    const response = await request(testApp.app)
      .post('/api/v1/compare')
      .set('Content-Type', 'application/json')
      .send('{"rig": {')
      .expect(400)
    expect(response.body.error.code).toBe('malformed-json')
    await compare([1, 2, 3]).expect(400)
  })

  it('throttles one address after its minute allowance, with Retry-After', async () => {
    const throttled = await postUntilThrottled('/api/v1/compare', 40)
    expect(throttled.status).toBe(429)
    expect(Number(throttled.retryAfter)).toBeGreaterThan(0)
    // 10 a minute (the route's allowance), then refused.
    expect(throttled.requests).toBe(11)
  })
})
